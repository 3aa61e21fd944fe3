package halfrail.parts;

/** Something the parts library lists and finds by a stable id. */
public sealed interface PartEntry permits CapacitorTechnology, OpAmpArchetype, CellChemistry, SupplyStandard {

    /** Stable id: lowercase letters and digits joined by hyphens, for example {@code "polyester-film"}. */
    String id();

    /** Name to show people. */
    String displayName();
}
