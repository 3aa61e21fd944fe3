package halfrail.circuit;

/** Argument checks shared by the element records. */
final class Check {
    private Check() {}

    static String name(String name) {
        if (name == null || name.isBlank()) {
            throw new CircuitException(CircuitException.Kind.BAD_NAME, "", "name", "an element needs a non-empty name");
        }
        return name;
    }

    static String node(String part, String field, String node) {
        if (node == null || node.isBlank()) {
            throw new CircuitException(CircuitException.Kind.BAD_NAME, part, field, part + ": terminal " + field + " is not connected to a named node");
        }
        return node;
    }

    static double positive(String part, String field, double value, String unit) {
        if (!Double.isFinite(value) || value <= 0) {
            throw new CircuitException(CircuitException.Kind.BAD_VALUE, part, field,
                    part + ": " + field + " must be a positive finite value in " + unit + ", got " + value);
        }
        return value;
    }

    static double nonNegative(String part, String field, double value, String unit) {
        if (!Double.isFinite(value) || value < 0) {
            throw new CircuitException(CircuitException.Kind.BAD_VALUE, part, field,
                    part + ": " + field + " must be zero or a positive finite value in " + unit + ", got " + value);
        }
        return value;
    }

    static double finite(String part, String field, double value, String unit) {
        if (!Double.isFinite(value)) {
            throw new CircuitException(CircuitException.Kind.BAD_VALUE, part, field,
                    part + ": " + field + " must be a finite value in " + unit + ", got " + value);
        }
        return value;
    }

    /** A relative tolerance as a fraction: 0.05 is ±5 %; must lie in [0, 1]. */
    static double fraction(String part, String field, double value) {
        if (!Double.isFinite(value) || value < 0 || value > 1) {
            throw new CircuitException(CircuitException.Kind.BAD_VALUE, part, field,
                    part + ": " + field + " must be a fraction between 0 and 1 (0.05 is 5 %), got " + value);
        }
        return value;
    }
}
