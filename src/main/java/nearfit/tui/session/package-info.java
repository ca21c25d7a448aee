/**
 * One explorer session on a terminal, as the {@code view} command runs it: opens the screen, loads the
 * file with a progress screen (Ctrl-C cancels), builds the first state from the command line's
 * {@link nearfit.tui.session.StartSettings}, runs the {@code loop.Explorer}, and restores the terminal on
 * every way out (quit, Ctrl-C, SIGTERM, an error), printing a failure as one line.
 *
 * <h2>Entry point</h2>
 * {@link nearfit.tui.session.TerminalSession#run}; exit status 0 after {@code q}, 130 after Ctrl-C, 2 for
 * an error (a file that cannot be loaded, say).
 */
package nearfit.tui.session;
