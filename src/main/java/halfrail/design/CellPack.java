package halfrail.design;

import halfrail.parts.CellChemistry;
import halfrail.parts.PartsLibrary;

import java.util.OptionalDouble;

/**
 * Cells of one chemistry in series. The per-cell figures come from the parts library; they are
 * planning values — the cell maker's data governs.
 *
 * @param chemistry     id of a cell chemistry in the parts library (for example {@code "alkaline-aa"})
 * @param cellsInSeries number of cells in series, at least 1; a multi-cell block (a 9 V block) counts as one
 */
public record CellPack(String chemistry, int cellsInSeries) implements Supply {
    public CellPack {
        if (chemistry == null || chemistry.isBlank()) {
            throw new DesignException("supply.chemistry", "is required (a cell chemistry id)");
        }
        if (cellsInSeries < 1 || cellsInSeries > 100) {
            throw new DesignException("supply.cellsInSeries", "must be between 1 and 100, got " + cellsInSeries);
        }
    }

    /** The chemistry's data from the parts library. @throws DesignException for an unknown id */
    public CellChemistry data() {
        PartsLibrary parts = PartsLibrary.builtIn();
        return parts.cellChemistry(chemistry).orElseThrow(() -> new DesignException("supply.chemistry",
                "unknown cell chemistry '" + chemistry + "'; known: "
                        + parts.cellChemistries().stream().map(CellChemistry::id).toList()));
    }

    @Override
    public double nominalVolts() {
        return cellsInSeries * data().unitNominalVolts();
    }

    @Override
    public double highVolts() {
        return cellsInSeries * data().unitFreshVolts();
    }

    @Override
    public double lowVolts() {
        return cellsInSeries * data().unitEndPointVolts();
    }

    @Override
    public double internalOhms() {
        return cellsInSeries * data().unitInternalOhms();
    }

    @Override
    public OptionalDouble capacityAmpHours() {
        return OptionalDouble.of(data().capacityAmpHours());
    }

    @Override
    public String safetyNote() {
        return data().safetyNote();
    }
}
