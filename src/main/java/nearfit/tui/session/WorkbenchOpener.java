package nearfit.tui.session;

import java.nio.file.Path;

import nearfit.tui.bench.JobControl;
import nearfit.tui.bench.Workbench;

/** Loads a file into a {@link Workbench}, reporting progress and stopping when cancelled. */
@FunctionalInterface
public interface WorkbenchOpener {
    /**
     * @throws nearfit.table.NearfitException with the loader's one-line message for a bad file
     * @throws java.util.concurrent.CancellationException when the control was cancelled
     */
    Workbench open(Path file, String shownName, JobControl control);
}
