package halfrail.parts;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The parts data: capacitor technologies, op-amp archetypes, cell chemistries and supply
 * standards, each listed in resource order and found by id. {@link #builtIn()} is the data
 * shipped in {@code halfrail/parts/*.json}, loaded once on first use (thread-safe); callers may
 * build their own library, for example with parts taken from a datasheet. Immutable.
 */
public final class PartsLibrary {

    private final Map<String, CapacitorTechnology> capacitorTechnologies;
    private final Map<String, OpAmpArchetype> opAmpArchetypes;
    private final Map<String, CellChemistry> cellChemistries;
    private final Map<String, SupplyStandard> supplyStandards;

    /**
     * A library of the given entries.
     *
     * @throws PartsException of kind DUPLICATE_ID when two entries of one kind share an id
     */
    public PartsLibrary(List<CapacitorTechnology> capacitorTechnologies, List<OpAmpArchetype> opAmpArchetypes,
                        List<CellChemistry> cellChemistries, List<SupplyStandard> supplyStandards) {
        this.capacitorTechnologies = index("capacitor technology", capacitorTechnologies);
        this.opAmpArchetypes = index("op-amp archetype", opAmpArchetypes);
        this.cellChemistries = index("cell chemistry", cellChemistries);
        this.supplyStandards = index("supply standard", supplyStandards);
    }

    /**
     * The built-in parts data, loaded from the class path on first use.
     *
     * @throws PartsException of kind BAD_DATA if a built-in resource is broken (a build defect)
     */
    public static PartsLibrary builtIn() {
        if (BuiltIn.FAILURE != null) {
            PartsException f = BuiltIn.FAILURE;
            throw new PartsException(f.kind(), f.resource(), f.jsonPath(), f.getMessage(), f);
        }
        return BuiltIn.LIBRARY;
    }

    /** Initialisation-on-demand holder: the JVM's class initialisation makes the one load thread-safe. */
    private static final class BuiltIn {
        static final PartsLibrary LIBRARY;
        static final PartsException FAILURE;

        static {
            PartsLibrary library = null;
            PartsException failure = null;
            try {
                library = PartsResources.loadBuiltIn();
            } catch (PartsException e) {
                failure = e;
            }
            LIBRARY = library;
            FAILURE = failure;
        }
    }

    public List<CapacitorTechnology> capacitorTechnologies() {
        return List.copyOf(capacitorTechnologies.values());
    }

    public Optional<CapacitorTechnology> capacitorTechnology(String id) {
        return Optional.ofNullable(id == null ? null : capacitorTechnologies.get(id));
    }

    /** @throws PartsException of kind UNKNOWN_ID naming the id and the known ones */
    public CapacitorTechnology requireCapacitorTechnology(String id) {
        return require("capacitor technology", capacitorTechnologies, id);
    }

    public List<OpAmpArchetype> opAmpArchetypes() {
        return List.copyOf(opAmpArchetypes.values());
    }

    public Optional<OpAmpArchetype> opAmpArchetype(String id) {
        return Optional.ofNullable(id == null ? null : opAmpArchetypes.get(id));
    }

    /** @throws PartsException of kind UNKNOWN_ID naming the id and the known ones */
    public OpAmpArchetype requireOpAmpArchetype(String id) {
        return require("op-amp archetype", opAmpArchetypes, id);
    }

    public List<CellChemistry> cellChemistries() {
        return List.copyOf(cellChemistries.values());
    }

    public Optional<CellChemistry> cellChemistry(String id) {
        return Optional.ofNullable(id == null ? null : cellChemistries.get(id));
    }

    /** @throws PartsException of kind UNKNOWN_ID naming the id and the known ones */
    public CellChemistry requireCellChemistry(String id) {
        return require("cell chemistry", cellChemistries, id);
    }

    public List<SupplyStandard> supplyStandards() {
        return List.copyOf(supplyStandards.values());
    }

    public Optional<SupplyStandard> supplyStandard(String id) {
        return Optional.ofNullable(id == null ? null : supplyStandards.get(id));
    }

    /** @throws PartsException of kind UNKNOWN_ID naming the id and the known ones */
    public SupplyStandard requireSupplyStandard(String id) {
        return require("supply standard", supplyStandards, id);
    }

    private static <T extends PartEntry> Map<String, T> index(String what, List<T> entries) {
        if (entries == null) {
            throw new PartsException(PartsException.Kind.BAD_VALUE, "the list of " + what + " entries is missing");
        }
        Map<String, T> byId = new LinkedHashMap<>();
        for (T entry : entries) {
            if (entry == null) {
                throw new PartsException(PartsException.Kind.BAD_VALUE, "a " + what + " entry is null");
            }
            if (byId.putIfAbsent(entry.id(), entry) != null) {
                throw new PartsException(PartsException.Kind.DUPLICATE_ID,
                        "two " + what + " entries share the id \"" + entry.id() + "\"");
            }
        }
        return Collections.unmodifiableMap(byId);
    }

    private static <T> T require(String what, Map<String, T> byId, String id) {
        T found = id == null ? null : byId.get(id);
        if (found == null) {
            throw new PartsException(PartsException.Kind.UNKNOWN_ID, "unknown " + what + " \"" + id
                    + "\"; known: " + String.join(", ", byId.keySet()));
        }
        return found;
    }
}
