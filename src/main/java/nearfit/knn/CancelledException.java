package nearfit.knn;

/** Thrown by a long run (tuning, flags, batch estimates) when its {@link Progress} asks to stop. */
public final class CancelledException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** A run stopped on request. */
    public CancelledException() {
        super("cancelled");
    }
}
