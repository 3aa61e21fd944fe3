package halfrail.ui;

import javafx.application.Platform;

import java.util.concurrent.Callable;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Consumer;

/**
 * Runs work on one worker thread owned by this instance (jobs run one after another, so a
 * burst of edits never piles up parallel analyses) and posts the callbacks to the FX thread.
 * A cancelled job's callbacks are never posted, even when its work had already finished.
 */
public final class BackgroundAnalysisExecutor implements AnalysisExecutor {
    private static final AtomicInteger WORKERS = new AtomicInteger();

    private final java.util.function.UnaryOperator<Runnable> onFxThread;

    /** An executor whose FX-thread callbacks run as they are. */
    public BackgroundAnalysisExecutor() {
        this(java.util.function.UnaryOperator.identity());
    }

    /**
     * An executor that hands every callback and update through {@code onFxThread} before posting
     * it to the FX thread (tests wrap them to time how long each holds the FX thread).
     */
    public BackgroundAnalysisExecutor(java.util.function.UnaryOperator<Runnable> onFxThread) {
        this.onFxThread = java.util.Objects.requireNonNull(onFxThread, "onFxThread");
    }

    private final ExecutorService worker = Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "halfrail-analysis-" + WORKERS.incrementAndGet());
        t.setDaemon(true);
        return t;
    });

    @Override
    public <T> Job submit(Callable<T> work, Consumer<T> onResult, Consumer<Throwable> onFailure) {
        BackgroundJob job = new BackgroundJob();
        job.future = worker.submit(() -> {
            if (job.cancelled()) {
                return;
            }
            try {
                T result = work.call();
                Platform.runLater(onFxThread.apply(() -> {
                    if (!job.cancelled()) {
                        onResult.accept(result);
                    }
                }));
            } catch (Exception | Error e) {
                Platform.runLater(onFxThread.apply(() -> {
                    if (!job.cancelled()) {
                        onFailure.accept(e);
                    }
                }));
            }
        });
        return job;
    }

    @Override
    public void post(Runnable update) {
        Platform.runLater(onFxThread.apply(update));
    }

    @Override
    public void shutdown() {
        worker.shutdownNow();
    }

    private static final class BackgroundJob implements Job {
        private final AtomicBoolean cancelled = new AtomicBoolean();
        private volatile Future<?> future;

        @Override
        public void cancel() {
            cancelled.set(true);
            Future<?> f = future;
            if (f != null) {
                f.cancel(true);
            }
        }

        @Override
        public boolean cancelled() {
            return cancelled.get();
        }
    }
}
