package halfrail.convert;

import java.util.Objects;

/**
 * Two requirements that cannot both be met, which one won, and by how much the other is missed.
 *
 * @param kind        what sort of conflict
 * @param winner      the requirement that was met, in words (for example "band low end 1 Hz")
 * @param loser       the requirement that was missed
 * @param limit       the missed requirement's limit, in {@code unit}
 * @param achieved    what the converted design achieves for it, in {@code unit}
 * @param missedBy    how far it is missed, {@code |achieved − limit|}, in {@code unit}
 * @param unit        the unit of the three numbers (s, Hz, A, V, h)
 * @param explanation the numbers and the rule in one or two sentences
 */
public record Conflict(ConflictKind kind, String winner, String loser, double limit, double achieved,
                       double missedBy, String unit, String explanation) {
    public Conflict {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(winner, "winner");
        Objects.requireNonNull(loser, "loser");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(explanation, "explanation");
    }
}
