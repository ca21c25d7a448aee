package nearfit.tui.session;

import java.util.ArrayList;
import java.util.List;

/**
 * tmux command lines on a server of the session's own ({@code -L NAME}): tests that share the
 * default server raced when one test's last session ended it while another started a session
 * ("server exited unexpectedly"), also between two builds on one machine.
 */
public final class TmuxSocket {
    private TmuxSocket() {
    }

    /** {@code tmux -L SESSION ARGS...}, the socket named after the session that the args name. */
    public static List<String> command(String... args) {
        String session = null;
        for (int i = 0; i + 1 < args.length; i++) {
            if (args[i].equals("-t") || args[i].equals("-s")) {
                session = args[i + 1];
                break;
            }
        }
        if (session == null) {
            throw new IllegalArgumentException("no -t or -s session in " + String.join(" ", args));
        }
        List<String> cmd = new ArrayList<>(List.of("tmux", "-L", session));
        cmd.addAll(List.of(args));
        return cmd;
    }
}
