package halfrail.ui;

import halfrail.design.Design;

import java.util.ArrayDeque;
import java.util.Deque;
import java.util.Objects;
import java.util.Optional;

/**
 * The command stack behind undo and redo. Designs are immutable, so an edit is recorded as the
 * design before and after it; undoing an edit restores the first, redoing it the second. A new
 * edit clears the redo side. At most {@link #DEPTH_LIMIT} edits are kept.
 */
public final class EditHistory {
    /** The most edits kept for undo; the oldest are forgotten beyond this. */
    public static final int DEPTH_LIMIT = 500;

    /** One recorded edit. @param description what the edit did, in words (for menu labels) */
    public record DesignEdit(String description, Design before, Design after) {
        public DesignEdit {
            Objects.requireNonNull(description, "description");
            Objects.requireNonNull(before, "before");
            Objects.requireNonNull(after, "after");
        }
    }

    private final Deque<DesignEdit> undo = new ArrayDeque<>();
    private final Deque<DesignEdit> redo = new ArrayDeque<>();

    /** Record an edit that has just been applied. */
    public void record(DesignEdit edit) {
        undo.push(edit);
        while (undo.size() > DEPTH_LIMIT) {
            undo.removeLast();
        }
        redo.clear();
    }

    /** Take back the latest edit: the design to return to, if there is an edit to undo. */
    public Optional<DesignEdit> undo() {
        if (undo.isEmpty()) {
            return Optional.empty();
        }
        DesignEdit e = undo.pop();
        redo.push(e);
        return Optional.of(e);
    }

    /** Apply again the latest undone edit, if there is one. */
    public Optional<DesignEdit> redo() {
        if (redo.isEmpty()) {
            return Optional.empty();
        }
        DesignEdit e = redo.pop();
        undo.push(e);
        return Optional.of(e);
    }

    public Optional<DesignEdit> nextUndo() {
        return Optional.ofNullable(undo.peek());
    }

    public Optional<DesignEdit> nextRedo() {
        return Optional.ofNullable(redo.peek());
    }

    /** Forget every edit (a different design was opened). */
    public void clear() {
        undo.clear();
        redo.clear();
    }

    public int undoDepth() {
        return undo.size();
    }
}
