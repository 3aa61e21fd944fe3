package halfrail.convert;

import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * The dual-rail original: a chain of DC-coupled stages on a ± supply.
 *
 * @param stages        the stages in signal order, at least one
 * @param positiveVolts the positive rail above ground, V
 * @param negativeVolts the negative rail's magnitude below ground, V (15 for a −15 V rail)
 */
public record DualRailChain(List<DualRailStage> stages, double positiveVolts, double negativeVolts) {
    /** Most stages a chain may have. */
    public static final int MAX_STAGES = 8;

    public DualRailChain {
        ConversionException.RULES.required("original.stages", stages);
        if (stages.isEmpty()) {
            throw new ConversionException("original.stages", "the chain needs at least one stage");
        }
        if (stages.size() > MAX_STAGES) {
            throw new ConversionException("original.stages", "at most " + MAX_STAGES + " stages, got " + stages.size());
        }
        stages = List.copyOf(stages);
        Set<String> names = new HashSet<>();
        for (int i = 0; i < stages.size(); i++) {
            if (!names.add(stages.get(i).name())) {
                throw new ConversionException("original.stages[" + i + "].name",
                        "'" + stages.get(i).name() + "' is used by another stage");
            }
        }
        ConversionException.RULES.positive("original.positiveVolts", positiveVolts, "V");
        ConversionException.RULES.positive("original.negativeVolts", negativeVolts, "V");
    }

    /** The whole chain's gain from the resistor values, V/V. */
    public double gain() {
        double g = 1;
        for (DualRailStage s : stages) {
            g *= s.gain();
        }
        return g;
    }

    /** Total supply across the op-amps, V. */
    public double totalVolts() {
        return positiveVolts + negativeVolts;
    }
}
