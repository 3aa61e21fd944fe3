package halfrail.check;

import java.lang.reflect.RecordComponent;
import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

import static org.junit.jupiter.api.Assertions.assertTrue;

/** Assertions over whole reports. */
final class ReportAssertions {
    private ReportAssertions() {}

    /**
     * Every number a report holds is finite: walks the report's records, lists, maps and optionals
     * (the design itself excepted: it is the input, not a result) and lists each NaN or infinity
     * with its path.
     */
    static void assertAllFinite(DesignReport report) {
        List<String> bad = new ArrayList<>();
        for (RecordComponent rc : DesignReport.class.getRecordComponents()) {
            if (rc.getName().equals("design")) {
                continue;
            }
            walk(value(rc, report), rc.getName(), bad);
        }
        assertTrue(bad.isEmpty(), () -> "non-finite numbers in the report of '" + report.design().name() + "': " + bad);
    }

    private static void walk(Object v, String path, List<String> bad) {
        if (v == null) {
            return;
        }
        if (v instanceof Double d) {
            if (!Double.isFinite(d)) {
                bad.add(path + " = " + d);
            }
        } else if (v instanceof Float f) {
            if (!Float.isFinite(f)) {
                bad.add(path + " = " + f);
            }
        } else if (v instanceof OptionalDouble od) {
            if (od.isPresent()) {
                walk(od.getAsDouble(), path, bad);
            }
        } else if (v instanceof Optional<?> o) {
            o.ifPresent(x -> walk(x, path, bad));
        } else if (v instanceof Map<?, ?> m) {
            m.forEach((k, x) -> walk(x, path + "[" + k + "]", bad));
        } else if (v instanceof Collection<?> c) {
            int i = 0;
            for (Object x : c) {
                walk(x, path + "[" + i++ + "]", bad);
            }
        } else if (v.getClass().isRecord()) {
            for (RecordComponent rc : v.getClass().getRecordComponents()) {
                walk(value(rc, v), path + "." + rc.getName(), bad);
            }
        }
    }

    private static Object value(RecordComponent rc, Object owner) {
        try {
            rc.getAccessor().setAccessible(true);
            return rc.getAccessor().invoke(owner);
        } catch (ReflectiveOperationException e) {
            throw new AssertionError("cannot read " + rc.getName(), e);
        }
    }
}
