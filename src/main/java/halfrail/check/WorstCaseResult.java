package halfrail.check;

import halfrail.design.Design;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The extreme-value analysis of a design.
 *
 * @param design      the design analysed
 * @param supplyVolts the supply voltage of every build, V
 * @param parameters  the varied parameters
 * @param opAmps      every op-amp, the reference buffer (if any) first
 * @param solves      DC solves spent
 */
public record WorstCaseResult(Design design, double supplyVolts, List<ToleranceParameter> parameters,
                              List<StageWorstCase> opAmps, int solves) {
    public WorstCaseResult {
        parameters = List.copyOf(parameters);
        opAmps = List.copyOf(opAmps);
    }

    public Optional<StageWorstCase> opAmp(String label) {
        return opAmps.stream().filter(s -> s.label().equals(label)).findFirst();
    }

    /** Whether every op-amp passes at both of its corners. */
    public boolean passesAtWorst() {
        return opAmps.stream().allMatch(StageWorstCase::passesAtWorst);
    }

    /** The ladders with each op-amp's rest-point spread (min and max over the corners) filled in. */
    public List<Ladder> withSpread(List<Ladder> ladders) {
        List<Ladder> out = new ArrayList<>();
        for (Ladder l : ladders) {
            out.add(opAmp(l.opAmp()).map(s -> l.withSpread(s.minQuiescentVolts(), s.maxQuiescentVolts())).orElse(l));
        }
        return out;
    }
}
