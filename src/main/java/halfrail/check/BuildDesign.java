package halfrail.check;

import halfrail.design.Design;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One tolerance build written back into a design.
 *
 * @param design     a copy of the study's design with the build's values in its fields
 * @param values     every varied parameter's value in this build, by parameter id, in the kind's unit
 * @param notCarried ids of varied quantities the design model cannot hold (see {@link ToleranceModel#buildDesign})
 */
public record BuildDesign(Design design, Map<String, Double> values, List<String> notCarried) {
    public BuildDesign {
        values = Collections.unmodifiableMap(new LinkedHashMap<>(values));
        notCarried = List.copyOf(notCarried);
    }
}
