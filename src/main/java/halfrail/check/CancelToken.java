package halfrail.check;

import java.util.concurrent.atomic.AtomicBoolean;

/**
 * A request to stop a long study, shared between the caller and the workers. Workers check it
 * between builds; a cancelled study ends in {@link StudyCancelledException}. Thread-safe.
 */
public final class CancelToken {
    private final AtomicBoolean cancelled = new AtomicBoolean();

    /** A token that nobody has cancelled yet. */
    public CancelToken() {}

    /** A token that is never cancelled (for callers that do not need one). */
    public static CancelToken none() {
        return new CancelToken();
    }

    /** Ask the study to stop; idempotent. */
    public void cancel() {
        cancelled.set(true);
    }

    public boolean isCancelled() {
        return cancelled.get();
    }
}
