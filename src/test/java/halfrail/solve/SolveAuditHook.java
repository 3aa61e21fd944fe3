package halfrail.solve;

import net.jqwik.api.lifecycle.AroundTryHook;
import net.jqwik.api.lifecycle.PropagationMode;
import net.jqwik.api.lifecycle.TryExecutionResult;
import net.jqwik.api.lifecycle.TryExecutor;
import net.jqwik.api.lifecycle.TryLifecycleContext;

import java.lang.reflect.AnnotatedElement;
import java.util.List;
import java.util.Optional;

/**
 * The jqwik side of {@link SolveAuditExtension} (jqwik properties do not run Jupiter extensions):
 * registered for every property through META-INF/services/net.jqwik.api.lifecycle.LifecycleHook,
 * it falsifies a try whose solver results broke Kirchhoff's current law or held a non-finite
 * number, so that jqwik reports (and shrinks) the input that did it.
 */
public final class SolveAuditHook implements AroundTryHook {
    /** Tries this hook has wrapped (SolveAuditHookTest checks that jqwik runs it). */
    static final java.util.concurrent.atomic.AtomicLong TRIES = new java.util.concurrent.atomic.AtomicLong();

    @Override
    public TryExecutionResult aroundTry(TryLifecycleContext context, TryExecutor executor, List<Object> parameters) {
        TRIES.incrementAndGet();
        SolveAuditor.install();
        TryExecutionResult result = executor.execute(parameters);
        AssertionError e = SolveAuditor.drain();
        if (e != null && !result.isFalsified()) {
            return TryExecutionResult.falsified(e);
        }
        return result;
    }

    @Override
    public PropagationMode propagateTo() {
        return PropagationMode.ALL_DESCENDANTS;
    }

    @Override
    public boolean appliesTo(Optional<AnnotatedElement> element) {
        return true;
    }
}
