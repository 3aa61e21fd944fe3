package halfrail.ui;

import java.util.concurrent.Callable;
import java.util.function.Consumer;

/**
 * Runs check-layer work for the view-models. The view-models never call the check layer on
 * the FX thread themselves: they hand the work to an executor and get the result back through
 * callbacks. {@link BackgroundAnalysisExecutor} runs the work on its own worker thread and
 * delivers the callbacks on the FX thread; {@link SynchronousAnalysisExecutor} runs everything
 * in the caller's thread, for deterministic tests.
 */
public interface AnalysisExecutor {

    /**
     * Start {@code work}; exactly one of the callbacks is called once, unless the job is
     * cancelled first (then neither is).
     *
     * @param work      the computation (an analysis); must not touch the scene graph
     * @param onResult  receives the result (on the FX thread for the background executor)
     * @param onFailure receives what the work threw
     * @return a handle to cancel the job
     */
    <T> Job submit(Callable<T> work, Consumer<T> onResult, Consumer<Throwable> onFailure);

    /**
     * Hand a short update (a study's progress, say) from any thread to the thread the callbacks
     * run on: the FX thread for the background executor, at once for the synchronous one.
     * {@code update} must be quick; it runs whether or not a job is cancelled.
     */
    default void post(Runnable update) {
        update.run();
    }

    /** Stop accepting work and let the worker end. */
    void shutdown();

    /** A started piece of work. */
    interface Job {
        /** Drop the job: its callbacks will not be called, and it is interrupted when already running. */
        void cancel();

        /** Whether {@link #cancel()} was called. */
        boolean cancelled();
    }
}
