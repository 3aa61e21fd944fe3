package halfrail.parts;

import java.util.Map;
import java.util.Set;

/**
 * The voltage range a supply standard promises at its connector, and how low a device should
 * keep working. The built-in entries live in {@code halfrail/parts/supply-standards.json}.
 *
 * @param id             stable id, for example {@value #USB2_PORT}
 * @param displayName    name to show people
 * @param nominalVolts   nominal voltage, V
 * @param portMinVolts   lowest voltage the standard allows at the source's connector, V
 * @param portMaxVolts   highest voltage the standard allows at the source's connector, V
 * @param deviceMinVolts lowest voltage a device should work down to (after cable and connector drops), V
 * @param note           cautions and scope
 * @param basis          per field, where the figures come from
 */
public record SupplyStandard(String id, String displayName, double nominalVolts, double portMinVolts,
                             double portMaxVolts, double deviceMinVolts, String note, Map<String, String> basis)
        implements PartEntry {

    public static final String USB2_PORT = "usb2-port";

    private static final Set<String> BASIS_FIELDS = Set.of("nominalVolts", "portRange", "deviceMinVolts");
    private static final Set<String> BASIS_REQUIRED = Set.of("portRange", "deviceMinVolts");

    public SupplyStandard {
        Require.id("supply standard", id);
        String owner = "supply standard " + id;
        Require.text(owner, "displayName", displayName);
        Require.positive(owner, "nominalVolts", nominalVolts, "V");
        Require.positive(owner, "portMinVolts", portMinVolts, "V");
        Require.positive(owner, "portMaxVolts", portMaxVolts, "V");
        Require.positive(owner, "deviceMinVolts", deviceMinVolts, "V");
        if (!(deviceMinVolts <= portMinVolts && portMinVolts <= nominalVolts && nominalVolts <= portMaxVolts)) {
            throw Require.bad("portMinVolts", owner + ": voltages must satisfy deviceMinVolts <= portMinVolts <= nominalVolts"
                    + " <= portMaxVolts");
        }
        Require.text(owner, "note", note);
        basis = Require.basis(owner, basis, BASIS_FIELDS, BASIS_REQUIRED);
    }

    /** Whether {@code volts} V lies within the range allowed at the connector. */
    public boolean withinPortRange(double volts) {
        return volts >= portMinVolts && volts <= portMaxVolts;
    }
}
