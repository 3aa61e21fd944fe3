package halfrail.solve;

import java.util.List;
import java.util.Objects;

/**
 * An analysis could not produce a result. Callers switch on {@link #kind()}; the message is for
 * people. Every iterative loop in this package ends either in a result or in one of these.
 */
public final class AnalysisException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** Why an analysis ended without a result. */
    public enum Kind {
        /** The linear system is singular: a pivot fell below the solver's threshold. */
        SINGULAR,
        /** Newton's method did not converge within its iteration limit, after every fallback. */
        NO_CONVERGENCE,
        /** The transient step size fell below its minimum. */
        STEP_TOO_SMALL,
        /** The transient used up its budget of time steps before reaching its stop time. */
        STEP_LIMIT,
        /** One or more nodes have no DC path to a defined voltage; {@link #nodes()} names them. */
        FLOATING_NODE,
        /** The request itself is invalid (unknown source or node, bad frequency range, …). */
        BAD_REQUEST
    }

    private final Kind kind;
    private final List<String> nodes;

    public AnalysisException(Kind kind, String message) {
        this(kind, message, List.of());
    }

    public AnalysisException(Kind kind, String message, List<String> nodes) {
        super(message);
        this.kind = Objects.requireNonNull(kind, "kind");
        this.nodes = List.copyOf(nodes);
    }

    public Kind kind() {
        return kind;
    }

    /** The nodes concerned (floating nodes, or the node where a solve failed); may be empty. */
    public List<String> nodes() {
        return nodes;
    }
}
