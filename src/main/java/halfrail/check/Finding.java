package halfrail.check;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * One thing the checks found.
 *
 * @param code       a stable identifier of the kind of finding (for example {@code BIAS_AMPLIFIED});
 *                   pipelines and tests switch on it
 * @param severity   how serious it is
 * @param message    what is wrong, with the numbers and their units
 * @param parts      design paths of the parts concerned (for example {@code stages[0].legCapacitor})
 * @param suggestion a concrete change that fixes it, with a standard value where one does
 * @param opAmp      label of the op-amp (stage) it concerns, when it concerns one
 * @param level      the ladder level it concerns, when it concerns one
 */
public record Finding(String code, Severity severity, String message, List<String> parts, String suggestion,
                      Optional<String> opAmp, Optional<LadderLevel> level) {
    public Finding {
        Objects.requireNonNull(code, "code");
        Objects.requireNonNull(severity, "severity");
        Objects.requireNonNull(message, "message");
        parts = List.copyOf(parts);
        suggestion = suggestion == null ? "" : suggestion;
        opAmp = opAmp == null ? Optional.empty() : opAmp;
        level = level == null ? Optional.empty() : level;
    }

    /** A finding about the design as a whole. */
    static Finding of(String code, Severity severity, String message, List<String> parts, String suggestion) {
        return new Finding(code, severity, message, parts, suggestion, Optional.empty(), Optional.empty());
    }

    /** A finding about one op-amp and one level of its ladder. */
    static Finding at(String code, Severity severity, String message, List<String> parts, String suggestion,
                      String opAmp, LadderLevel level) {
        return new Finding(code, severity, message, parts, suggestion, Optional.of(opAmp), Optional.ofNullable(level));
    }
}
