package halfrail.check;

import java.util.List;

/**
 * One op-amp's extremes over the tolerance corners. Voltages in V, headroom in dB.
 *
 * @param label             the stage's name, or "reference buffer"
 * @param designPath        the stage's design path
 * @param signal            whether it carries the signal
 * @param nominalQuiescentVolts rest point of the nominal build
 * @param minQuiescentVolts lowest rest point among the solved corners
 * @param maxQuiescentVolts highest rest point among the solved corners
 * @param nominalHeadroomDb headroom of the nominal build at the nominal signal
 * @param minHeadroomDb     smallest headroom among the solved corners (negative: clips; −∞: no room at all)
 * @param maxHeadroomDb     largest headroom among the nominal build and the solved corners
 * @param saturatedAtACorner whether the op-amp leaves its linear region at either corner
 * @param passesAtWorst     whether it still passes (not saturated, headroom ≥ minHeadroomDb) at both corners
 * @param drivers           the parameters that move its rest point, largest |swingVolts| first (zero ones left out)
 * @param lowCorner         the build that drives its rest point lowest, as a design
 * @param highCorner        the build that drives its rest point highest, as a design
 */
public record StageWorstCase(String label, String designPath, boolean signal, double nominalQuiescentVolts,
                             double minQuiescentVolts, double maxQuiescentVolts, double nominalHeadroomDb,
                             double minHeadroomDb, double maxHeadroomDb, boolean saturatedAtACorner,
                             boolean passesAtWorst, List<PartInfluence> drivers, BuildDesign lowCorner,
                             BuildDesign highCorner) {
    public StageWorstCase {
        drivers = List.copyOf(drivers);
    }
}
