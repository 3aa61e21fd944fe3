package halfrail.cli;

import java.util.List;

/**
 * One finding of {@code check}.
 *
 * @param code     a stable upper-case code (see {@link NetlistFindings})
 * @param severity how bad it is
 * @param message  one sentence for people, with the numbers
 * @param parts    names of the elements concerned
 */
public record Finding(String code, Severity severity, String message, List<String> parts) {
    public Finding {
        parts = List.copyOf(parts);
    }
}
