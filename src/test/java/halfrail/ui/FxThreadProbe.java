package halfrail.ui;

import javafx.application.Platform;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import java.util.stream.Stream;

/**
 * Measures how long the FX thread is held up: a probe thread posts a pulse to the FX thread every
 * {@code periodMs}; each pulse records how long it waited before the FX thread ran it. On Linux the
 * time the FX thread itself spent waiting for a processor (the machine busy with other programs) is
 * read from the kernel's per-thread scheduler statistics ({@code /proc/self/task/<tid>/schedstat},
 * second field: time spent waiting on a run queue, ns; Linux kernel documentation, "scheduler
 * statistics") and subtracted, so that the result is the time the FX thread was busy or blocked
 * in this program, not the load of the machine; so is the render thread's wait for a processor (the
 * FX thread waits for the renderer at every pulse), the larger of the two, as they may overlap.
 * Without those statistics nothing is subtracted.
 * The collector's stop-the-world pauses (which halt every thread alike, and on a machine short of
 * processors stretch well past their usual length) are subtracted too.
 *
 * <p>What is left of a pulse's wait can still hold hiccups that are not this program's doing (a
 * safepoint, a page fault, the scheduler parking the thread on a busy 2-core machine), so the
 * probe also measures, for each pulse, how much processor time the FX thread itself used between
 * the post and the run ({@link #largestBusyMs()}: work Halfrail made it do, whatever the machine's
 * load), and times the FX-thread work Halfrail posts and the scene's layout passes directly
 * ({@link #timed(Runnable)}, {@link #watch(javafx.scene.Scene)}): each from its start to its end on the
 * FX thread, less the FX thread's wait for a processor and the collector's pauses in that time.
 */
final class FxThreadProbe implements AutoCloseable {
    /** The kernel's short name of the FX thread (thread names are cut to 15 characters). */
    static final String FX_THREAD_COMM = "JavaFX Applicat";
    /** The kernel's short name of the render thread, which the FX thread waits for at each pulse. */
    static final String RENDER_THREAD_COMM = "QuantumRenderer";

    private final ScheduledExecutorService probe = Executors.newSingleThreadScheduledExecutor(r -> {
        Thread t = new Thread(r, "fx-probe");
        t.setDaemon(true);
        return t;
    });
    private final Optional<Path> schedstat;
    private final Optional<Path> renderSchedstat;
    private final AtomicLong largestHeldUpNanos = new AtomicLong();
    private final AtomicLong largestLatencyNanos = new AtomicLong();
    private final AtomicLong pulses = new AtomicLong();
    private final AtomicLong largestBusyNanos = new AtomicLong();
    private final AtomicLong largestTaskNanos = new AtomicLong();
    private final AtomicLong tasks = new AtomicLong();
    private final AtomicLong largestLayoutNanos = new AtomicLong();
    private final AtomicLong layouts = new AtomicLong();
    private final java.lang.management.ThreadMXBean threads = java.lang.management.ManagementFactory.getThreadMXBean();
    private final long fxThreadId;
    private javafx.scene.Scene watched;
    private final Runnable layoutStart = this::layoutStarted;
    private final Runnable layoutEnd = this::layoutEnded;
    private long layoutStartNanos;
    private long layoutStartWait;
    private long layoutStartGc;

    FxThreadProbe(long periodMs) {
        schedstat = findSchedstat(FX_THREAD_COMM);
        renderSchedstat = findSchedstat(RENDER_THREAD_COMM);
        fxThreadId = fxThreadId();
        probe.scheduleAtFixedRate(() -> {
            long posted = System.nanoTime();
            long cpuAtPost = threads.getThreadCpuTime(fxThreadId);
            long waitAtPost = runQueueWaitNanos(schedstat);
            long renderWaitAtPost = runQueueWaitNanos(renderSchedstat);
            long gcAtPost = gcPauseMillis();
            Platform.runLater(() -> {
                long latency = System.nanoTime() - posted;
                // the larger of the two threads' waits for a processor (they may overlap, so not their sum)
                long waited = Math.max(Math.max(0, runQueueWaitNanos(schedstat) - waitAtPost),
                        Math.max(0, runQueueWaitNanos(renderSchedstat) - renderWaitAtPost))
                        + TimeUnit.MILLISECONDS.toNanos(Math.max(0, gcPauseMillis() - gcAtPost));
                largestLatencyNanos.accumulateAndGet(latency, Math::max);
                if (cpuAtPost >= 0) {
                    largestBusyNanos.accumulateAndGet(threads.getCurrentThreadCpuTime() - cpuAtPost, Math::max);
                }
                largestHeldUpNanos.accumulateAndGet(Math.max(0, latency - waited), Math::max);
                pulses.incrementAndGet();
            });
        }, 0, periodMs, TimeUnit.MILLISECONDS);
    }

    private static long fxThreadId() {
        java.util.concurrent.CompletableFuture<Long> id = new java.util.concurrent.CompletableFuture<>();
        Platform.runLater(() -> id.complete(Thread.currentThread().getId()));
        try {
            return id.get(30, TimeUnit.SECONDS);
        } catch (Exception e) {
            throw new IllegalStateException("the FX thread did not answer", e);
        }
    }

    /**
     * {@code task} timed when it runs on the FX thread: wall time less the FX thread's wait for a
     * processor and the collector's pauses meanwhile.
     */
    Runnable timed(Runnable task) {
        return () -> {
            long start = System.nanoTime();
            long wait = runQueueWaitNanos(schedstat);
            long gc = gcPauseMillis();
            try {
                task.run();
            } finally {
                largestTaskNanos.accumulateAndGet(heldUpSince(start, wait, gc), Math::max);
                tasks.incrementAndGet();
            }
        };
    }

    /** Time every layout pass of {@code scene} (CSS and layout of each pulse) the same way, until closed. */
    void watch(javafx.scene.Scene scene) {
        Platform.runLater(() -> {
            watched = scene;
            scene.addPreLayoutPulseListener(layoutStart);
            scene.addPostLayoutPulseListener(layoutEnd);
        });
    }

    private void layoutStarted() {
        layoutStartNanos = System.nanoTime();
        layoutStartWait = runQueueWaitNanos(schedstat);
        layoutStartGc = gcPauseMillis();
    }

    private void layoutEnded() {
        largestLayoutNanos.accumulateAndGet(heldUpSince(layoutStartNanos, layoutStartWait, layoutStartGc), Math::max);
        layouts.incrementAndGet();
    }

    private long heldUpSince(long start, long wait, long gc) {
        long wall = System.nanoTime() - start;
        long lost = Math.max(0, runQueueWaitNanos(schedstat) - wait)
                + TimeUnit.MILLISECONDS.toNanos(Math.max(0, gcPauseMillis() - gc));
        return Math.max(0, wall - lost);
    }

    private static Optional<Path> findSchedstat(String comm) {
        try (Stream<Path> tasks = Files.list(Path.of("/proc/self/task"))) {
            return tasks.filter(t -> {
                try {
                    return Files.readString(t.resolve("comm")).trim().equals(comm);
                } catch (IOException e) {
                    return false;
                }
            }).map(t -> t.resolve("schedstat")).filter(Files::isReadable).findFirst();
        } catch (IOException | RuntimeException e) {
            return Optional.empty();
        }
    }

    /**
     * Total time of the collections so far, ms: for the stop-the-world collectors (G1's young and
     * mixed collections, the default of Java 17) the time every thread, the FX thread included,
     * stood still (java.lang.management.GarbageCollectorMXBean#getCollectionTime).
     */
    private static long gcPauseMillis() {
        long sum = 0;
        for (java.lang.management.GarbageCollectorMXBean gc : java.lang.management.ManagementFactory.getGarbageCollectorMXBeans()) {
            sum += Math.max(0, gc.getCollectionTime());
        }
        return sum;
    }

    private static long runQueueWaitNanos(Optional<Path> stat) {
        if (stat.isEmpty()) {
            return 0;
        }
        try {
            String[] f = Files.readString(stat.get()).trim().split("\\s+");
            return Long.parseLong(f[1]);
        } catch (IOException | RuntimeException e) {
            return 0;
        }
    }

    /** Whether the machine's wait for a processor is subtracted. */
    boolean subtractsMachineLoad() {
        return schedstat.isPresent();
    }

    /** The longest a pulse waited for the FX thread, less the FX thread's own wait for a processor and the collector's pauses, ms. */
    long largestHeldUpMs() {
        return TimeUnit.NANOSECONDS.toMillis(largestHeldUpNanos.get());
    }

    /** The longest a pulse waited for the FX thread, as measured on the clock, ms. */
    long largestLatencyMs() {
        return TimeUnit.NANOSECONDS.toMillis(largestLatencyNanos.get());
    }

    long pulses() {
        return pulses.get();
    }

    /** The most processor time the FX thread used while a pulse waited for it, ms. */
    long largestBusyMs() {
        return TimeUnit.NANOSECONDS.toMillis(largestBusyNanos.get());
    }

    /** The longest a task passed through {@link #timed(Runnable)} held the FX thread, ms. */
    long largestTaskMs() {
        return TimeUnit.NANOSECONDS.toMillis(largestTaskNanos.get());
    }

    /** How many timed tasks ran. */
    long tasks() {
        return tasks.get();
    }

    /** The longest layout pass of the watched scene, ms. */
    long largestLayoutMs() {
        return TimeUnit.NANOSECONDS.toMillis(largestLayoutNanos.get());
    }

    /** How many layout passes of the watched scene were timed. */
    long layouts() {
        return layouts.get();
    }

    @Override
    public void close() {
        probe.shutdownNow();
        javafx.scene.Scene s = watched;
        if (s != null) {
            Platform.runLater(() -> {
                s.removePreLayoutPulseListener(layoutStart);
                s.removePostLayoutPulseListener(layoutEnd);
            });
        }
    }
}
