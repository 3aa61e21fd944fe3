package halfrail.parts;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;

/** Argument checks shared by the parts records; every failure is a {@link PartsException.Kind#BAD_VALUE}. */
final class Require {
    private static final Pattern ID = Pattern.compile("[a-z0-9]+(-[a-z0-9]+)*");

    private Require() {}

    static String id(String owner, String id) {
        if (id == null || !ID.matcher(id).matches()) {
            throw bad("id", owner + ": id must be lowercase letters and digits joined by hyphens "
                    + "(for example \"aluminium-electrolytic\"), got " + quote(id));
        }
        return id;
    }

    static String text(String owner, String field, String value) {
        if (value == null || value.isBlank()) {
            throw bad(field, owner + ": " + field + " must be a non-empty text");
        }
        return value;
    }

    static double positive(String owner, String field, double value, String unit) {
        if (!Double.isFinite(value) || value <= 0) {
            throw bad(field, owner + ": " + field + " must be a positive finite value in " + unit + ", got " + value);
        }
        return value;
    }

    static double nonNegative(String owner, String field, double value, String unit) {
        if (!Double.isFinite(value) || value < 0) {
            throw bad(field, owner + ": " + field + " must be zero or a positive finite value in " + unit + ", got " + value);
        }
        return value;
    }

    static double finite(String owner, String field, double value, String unit) {
        if (!Double.isFinite(value)) {
            throw bad(field, owner + ": " + field + " must be a finite value in " + unit + ", got " + value);
        }
        return value;
    }

    /** A fraction in (0, 1] when {@code allowZero} is false, [0, 1] otherwise. */
    static double fraction(String owner, String field, double value, boolean allowZero) {
        boolean ok = Double.isFinite(value) && value <= 1 && (allowZero ? value >= 0 : value > 0);
        if (!ok) {
            throw bad(field, owner + ": " + field + " must be a fraction " + (allowZero ? "from 0" : "above 0")
                    + " up to 1 (0.2 is 20 %), got " + value);
        }
        return value;
    }

    static <T> List<T> nonEmpty(String owner, String field, List<T> list) {
        if (list == null || list.isEmpty()) {
            throw bad(field, owner + ": " + field + " must list at least one entry");
        }
        for (T t : list) {
            if (t == null) {
                throw bad(field, owner + ": " + field + " must not contain null entries");
            }
        }
        return List.copyOf(list);
    }

    /**
     * The basis notes of a record: where each figure comes from. Every key must name one of
     * {@code allowed} (so a misspelt key fails) and every one of {@code required} must be there.
     */
    static Map<String, String> basis(String owner, Map<String, String> basis, Set<String> allowed,
                                     Set<String> required) {
        if (basis == null) {
            throw bad("basis", owner + ": basis is missing; it must say where " + required + " come from");
        }
        for (Map.Entry<String, String> e : basis.entrySet()) {
            if (!allowed.contains(e.getKey())) {
                throw bad("basis." + e.getKey(), owner + ": basis names unknown field " + quote(e.getKey()) + "; fields are " + allowed);
            }
            text(owner, "basis." + e.getKey(), e.getValue());
        }
        for (String r : required) {
            if (!basis.containsKey(r)) {
                throw bad("basis", owner + ": basis must say where " + r + " comes from");
            }
        }
        return Collections.unmodifiableMap(new LinkedHashMap<>(basis));
    }

    static PartsException bad(String message) {
        return new PartsException(PartsException.Kind.BAD_VALUE, message);
    }

    static PartsException bad(String field, String message) {
        return new PartsException(PartsException.Kind.BAD_VALUE, field, message);
    }

    static String quote(String s) {
        return s == null ? "null" : "\"" + s + "\"";
    }
}
