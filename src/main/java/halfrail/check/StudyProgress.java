package halfrail.check;

/**
 * Told how far a long study has got. Called from worker threads, possibly concurrently; an
 * implementation must be thread-safe and quick (a UI hands the numbers to its own thread).
 */
@FunctionalInterface
public interface StudyProgress {
    /** A listener that ignores progress. */
    StudyProgress NONE = (done, total) -> { };

    /** {@code done} of {@code total} builds (or points) are finished; done only grows. */
    void progress(long done, long total);
}
