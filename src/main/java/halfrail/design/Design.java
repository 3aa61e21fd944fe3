package halfrail.design;

import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * A single-supply design: the supply, the shared mid-rail reference, a chain of stages, the
 * source that drives the chain, the load it drives, and the limits the checks apply. Immutable.
 *
 * @param name        a title of the designer's
 * @param description free text, possibly empty
 * @param powerOnRampSeconds how long the supply takes to rise at switch-on, s (0 for a step)
 */
public record Design(String name, String description, Supply supply, Reference reference, List<Stage> stages,
                     SignalSource source, Load load, Thresholds thresholds, double powerOnRampSeconds) {

    /** Power-on ramp used when a design does not say, s. */
    public static final double DEFAULT_POWER_ON_RAMP_SECONDS = 1e-3;

    public Design {
        name = name == null ? "" : name;
        description = description == null ? "" : description;
        DesignException.RULES.required("supply", supply);
        DesignException.RULES.required("reference", reference);
        DesignException.RULES.required("stages", stages);
        stages = List.copyOf(stages);
        if (stages.isEmpty()) {
            throw new DesignException("stages", "a design needs at least one stage");
        }
        Set<String> names = new HashSet<>();
        for (int i = 0; i < stages.size(); i++) {
            if (!names.add(stages.get(i).name())) {
                throw new DesignException("stages[" + i + "].name", "'" + stages.get(i).name() + "' is used by another stage");
            }
        }
        DesignException.RULES.required("source", source);
        DesignException.RULES.required("load", load);
        DesignException.RULES.required("thresholds", thresholds);
        DesignException.RULES.nonNegative("powerOnRampSeconds", powerOnRampSeconds, "s");
    }

    public Design withSupply(Supply s) {
        return new Design(name, description, s, reference, stages, source, load, thresholds, powerOnRampSeconds);
    }

    public Design withReference(Reference r) {
        return new Design(name, description, supply, r, stages, source, load, thresholds, powerOnRampSeconds);
    }

    public Design withStages(List<Stage> s) {
        return new Design(name, description, supply, reference, s, source, load, thresholds, powerOnRampSeconds);
    }

    /** A copy with stage {@code index} replaced. */
    public Design withStage(int index, Stage s) {
        List<Stage> list = new java.util.ArrayList<>(stages);
        list.set(index, s);
        return withStages(list);
    }

    public Design withSource(SignalSource s) {
        return new Design(name, description, supply, reference, stages, s, load, thresholds, powerOnRampSeconds);
    }

    public Design withLoad(Load l) {
        return new Design(name, description, supply, reference, stages, source, l, thresholds, powerOnRampSeconds);
    }

    public Design withThresholds(Thresholds t) {
        return new Design(name, description, supply, reference, stages, source, load, t, powerOnRampSeconds);
    }
}
