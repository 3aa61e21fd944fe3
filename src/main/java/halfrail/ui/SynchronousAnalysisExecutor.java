package halfrail.ui;

import java.util.concurrent.Callable;
import java.util.function.Consumer;

/**
 * Runs the work at once in the caller's thread and calls back before {@link #submit} returns.
 * For tests, which then see every analysis complete in order.
 */
public final class SynchronousAnalysisExecutor implements AnalysisExecutor {
    private int jobsRun;
    private final Thread owner = Thread.currentThread();

    @Override
    public <T> Job submit(Callable<T> work, Consumer<T> onResult, Consumer<Throwable> onFailure) {
        jobsRun++;
        T result;
        try {
            result = work.call();
        } catch (Exception | Error e) {
            onFailure.accept(e);
            return DoneJob.INSTANCE;
        }
        onResult.accept(result);
        return DoneJob.INSTANCE;
    }

    /**
     * Run {@code update} at once when called on the thread that made this executor; drop it when
     * called from another thread (a study's worker): every job has finished before {@link #submit}
     * returns, so its final callback shows the final state anyway, and the updater may touch
     * properties that only the owning thread (the FX thread, in a window) may change.
     */
    @Override
    public void post(Runnable update) {
        if (Thread.currentThread() == owner) {
            update.run();
        }
    }

    /** How many jobs this executor has run. */
    public int jobsRun() {
        return jobsRun;
    }

    @Override
    public void shutdown() {
        // nothing runs in the background
    }

    /** A job that has already finished; cancelling it has no effect. */
    private enum DoneJob implements Job {
        INSTANCE;

        @Override
        public void cancel() {
            // already finished
        }

        @Override
        public boolean cancelled() {
            return false;
        }
    }
}
