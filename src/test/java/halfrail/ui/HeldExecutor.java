package halfrail.ui;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.function.Consumer;

/** An executor for tests that keeps every job until the test runs it, in any order it likes. */
final class HeldExecutor implements AnalysisExecutor {
    /** One held job. */
    final class Held implements Job {
        private final Runnable run;
        private Consumer<Throwable> failure;
        private boolean cancelled;

        Held(Runnable run) {
            this.run = run;
        }

        /** Run the work and deliver its result, unless cancelled. */
        void finish() {
            if (!cancelled) {
                run.run();
            }
        }

        @Override
        public void cancel() {
            cancelled = true;
        }

        @Override
        public boolean cancelled() {
            return cancelled;
        }
    }

    final List<Held> jobs = new ArrayList<>();

    @Override
    public <T> Job submit(Callable<T> work, Consumer<T> onResult, Consumer<Throwable> onFailure) {
        Held h = new Held(() -> {
            T r;
            try {
                r = work.call();
            } catch (Exception e) {
                onFailure.accept(e);
                return;
            }
            onResult.accept(r);
        });
        h.failure = onFailure;
        jobs.add(h);
        return h;
    }

    /** Deliver {@code error} as job {@code index}'s failure instead of running its work. */
    void fail(int index, Throwable error) {
        Held h = jobs.get(index);
        if (!h.cancelled) {
            h.failure.accept(error);
        }
    }

    @Override
    public void shutdown() {
        jobs.clear();
    }
}
