package nearfit.tui;

import java.nio.file.Path;

import nearfit.table.NearfitException;

/** The {@link Workbench} on the real core packages. */
public final class CoreWorkbench {
    private CoreWorkbench() {
    }

    /** Loads a file with the table package's loader. */
    public static Workbench open(Path file, String shownName, JobControl control) {
        // The table, knn and plot packages have not landed on main yet; this is replaced when they do.
        throw NearfitException.inFile(shownName, "cannot be opened: the explorer's loader is not built yet");
    }
}
