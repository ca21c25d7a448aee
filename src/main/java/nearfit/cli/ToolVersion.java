package nearfit.cli;

/** The version written into model files: the jar manifest's, or "dev" when run from classes. */
final class ToolVersion {
    private ToolVersion() {
    }

    static String get() {
        String v = Main.class.getPackage().getImplementationVersion();
        return v == null ? "dev" : v;
    }
}
