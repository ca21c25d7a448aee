package nearfit.tui.keys;

/** What the export menu can write. */
public enum ExportKind {
    CURVE_CSV("fitted curve (CSV)", "nearfit-curve.csv"),
    FLAGS_CSV("flagged rows (CSV)", "nearfit-flagged.csv"),
    PNG("plot (PNG)", "nearfit-plot.png"),
    TEXT("plot (plain text)", "nearfit-plot.txt");

    private final String title;
    private final String defaultFile;

    ExportKind(String title, String defaultFile) {
        this.title = title;
        this.defaultFile = defaultFile;
    }

    /** The menu line. */
    public String title() {
        return title;
    }

    /** The file name offered first. */
    public String defaultFile() {
        return defaultFile;
    }
}
