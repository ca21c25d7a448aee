package nearfit.table;

/**
 * Thrown when a load is cancelled through {@link LoadOptions.Builder#cancelSignal} or by interrupting the
 * loading thread. It is a {@link NearfitException} so faces can print it on one line, but callers that
 * cancel on purpose catch this type and drop the partial work.
 */
public final class LoadCancelledException extends NearfitException {
    private static final long serialVersionUID = 1L;

    /** @param file the file whose load was cancelled, as the user named it */
    public LoadCancelledException(String file) {
        super(file, NO_LINE, null, "loading cancelled", null);
    }
}
