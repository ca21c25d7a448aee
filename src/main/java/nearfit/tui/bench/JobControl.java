package nearfit.tui.bench;

/** What a background job sees of the explorer: whether it is still wanted, and where to say how far it got. */
public interface JobControl {
    /** Whether a newer setting made this job useless; long loops check it and stop. */
    boolean cancelled();

    /** Reports progress, {@code fraction} from 0 to 1. */
    void progress(double fraction);

    /** Reports rows read so far, for work whose total is unknown (a gzip file's load). */
    default void rows(long rows) {
    }

    /** A control that is never cancelled and ignores progress, for exports and tests. */
    JobControl NONE = new JobControl() {
        @Override
        public boolean cancelled() {
            return false;
        }

        @Override
        public void progress(double fraction) {
        }
    };
}
