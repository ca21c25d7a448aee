package nearfit.cli;

/** The version written into model files: the jar manifest's, or "dev" when run from classes. */
final class ToolVersion {
    private ToolVersion() {
    }

    static String get() {
        String v = Main.class.getPackage().getImplementationVersion();
        return v == null ? "dev" : v;
    }

    /**
     * The Java runtime running the tool and the start-up cache it was given by the launcher, for
     * {@code --version}: for example {@code "Java 25.0.3 (/usr/lib/jvm/temurin-25), start-up cache: none"}.
     */
    static String runtime() {
        String cache = System.getenv("NEARFIT_STARTUP_CACHE");
        return "Java " + System.getProperty("java.version") + " (" + System.getProperty("java.home") + "), start-up cache: "
                + (cache == null || cache.isEmpty() ? "none" : cache);
    }
}
