package halfrail.convert;

import java.util.Objects;

/**
 * One change the conversion made, and why.
 *
 * @param kind       what sort of change
 * @param designPath where in the converted design (for example {@code stages[0].legCapacitor}), or
 *                   {@code ""} for the design as a whole
 * @param before     what the original had there, with units ("none" when the part is new)
 * @param after      what the converted design has, with units
 * @param reason     why, with the rule or number behind it
 */
public record Change(ChangeKind kind, String designPath, String before, String after, String reason) {
    public Change {
        Objects.requireNonNull(kind, "kind");
        designPath = designPath == null ? "" : designPath;
        before = before == null ? "" : before;
        after = after == null ? "" : after;
        Objects.requireNonNull(reason, "reason");
    }
}
