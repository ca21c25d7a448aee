package nearfit.tui.results;

/**
 * The latest results of the background jobs, each for the settings it was asked for; a frame is drawn from
 * a {@link nearfit.tui.keys.ViewState} and this value. Progress is NaN when that job is not running.
 *
 * @param curve          the latest curve, or {@code null}
 * @param curveProgress  progress of the running curve job
 * @param tuning         the latest tuning, or {@code null}
 * @param tuningProgress progress of the running tuning job
 * @param flags          the latest flags, or {@code null}
 * @param flagsProgress  progress of the running flags job
 * @param rowsUsed       rows satisfying the row condition
 * @param failure        the last job failure as one line, empty for none
 */
public record Results(CurveResult curve, double curveProgress, TuningFigures tuning, double tuningProgress,
        FlaggedRows flags, double flagsProgress, int rowsUsed, String failure) {
    /** No results yet. */
    public static Results none(int rowsUsed) {
        return new Results(null, Double.NaN, null, Double.NaN, null, Double.NaN, rowsUsed, "");
    }

    public Results withCurve(CurveResult c, double progress) {
        return new Results(c, progress, tuning, tuningProgress, flags, flagsProgress, rowsUsed, failure);
    }

    public Results withTuning(TuningFigures t, double progress) {
        return new Results(curve, curveProgress, t, progress, flags, flagsProgress, rowsUsed, failure);
    }

    public Results withFlags(FlaggedRows f, double progress) {
        return new Results(curve, curveProgress, tuning, tuningProgress, f, progress, rowsUsed, failure);
    }

    public Results withRowsUsed(int rows) {
        return new Results(curve, curveProgress, tuning, tuningProgress, flags, flagsProgress, rows, failure);
    }

    public Results withFailure(String f) {
        return new Results(curve, curveProgress, tuning, tuningProgress, flags, flagsProgress, rowsUsed, f);
    }
}
