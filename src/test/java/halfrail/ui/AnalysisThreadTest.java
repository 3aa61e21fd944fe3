package halfrail.ui;

import javafx.application.Platform;
import org.junit.jupiter.api.Test;
import org.testfx.api.FxToolkit;
import org.testfx.util.WaitForAsyncUtils;

import java.util.Optional;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.Consumer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The analysis runs off the FX thread and its result comes back on it. A gate holds the analysis
 * after it has started; while it is held the FX thread still runs other work, so an analysis
 * never blocks the window, however long it takes.
 */
class AnalysisThreadTest {
    /** Wraps the background executor, recording threads and holding each job at a gate. */
    static final class GatedExecutor implements AnalysisExecutor {
        final BackgroundAnalysisExecutor inner = new BackgroundAnalysisExecutor();
        final CountDownLatch started = new CountDownLatch(1);
        final CountDownLatch gate = new CountDownLatch(1);
        final AtomicBoolean workOnFxThread = new AtomicBoolean();
        final AtomicReference<Boolean> callbackOnFxThread = new AtomicReference<>();

        @Override
        public <T> Job submit(Callable<T> work, Consumer<T> onResult, Consumer<Throwable> onFailure) {
            return inner.submit(() -> {
                workOnFxThread.compareAndSet(false, Platform.isFxApplicationThread());
                started.countDown();
                if (!gate.await(60, TimeUnit.SECONDS)) {
                    throw new IllegalStateException("gate never opened");
                }
                return work.call();
            }, r -> {
                callbackOnFxThread.set(Platform.isFxApplicationThread());
                onResult.accept(r);
            }, onFailure);
        }

        @Override
        public void shutdown() {
            inner.shutdown();
        }
    }

    @Test
    void theAnalysisRunsOffTheFxThreadWhileTheFxThreadStaysFree() throws Exception {
        FxToolkit.registerPrimaryStage();
        GatedExecutor exec = new GatedExecutor();
        WorkbenchModel model = WaitForAsyncUtils.asyncFx(
                () -> new WorkbenchModel(exec, SampleDesigns.instrumentBoost(), Optional.empty())).get(10, TimeUnit.SECONDS);
        assertTrue(exec.started.await(30, TimeUnit.SECONDS), "the analysis started");
        // the analysis is now held on its worker; the FX thread must still answer
        Integer answer = WaitForAsyncUtils.asyncFx(() -> 42).get(10, TimeUnit.SECONDS);
        assertEquals(42, answer);
        assertTrue(WaitForAsyncUtils.asyncFx(() -> model.analysingProperty().get()).get());
        assertTrue(WaitForAsyncUtils.asyncFx(() -> model.reportProperty().get() == null).get());
        exec.gate.countDown();
        WaitForAsyncUtils.waitFor(60, TimeUnit.SECONDS, () -> model.reportProperty().get() != null);
        assertFalse(exec.workOnFxThread.get(), "the analysis ran on a worker thread");
        assertNotNull(exec.callbackOnFxThread.get());
        assertTrue(exec.callbackOnFxThread.get(), "the result came back on the FX thread");
        exec.shutdown();
    }
}
