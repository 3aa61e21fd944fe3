package halfrail.io;

import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import halfrail.circuit.OpAmpParams;
import halfrail.design.CapacitorSpec;
import halfrail.design.CellPack;
import halfrail.design.Design;
import halfrail.design.FixedRail;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.ReferenceKind;
import halfrail.design.SignalSource;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.Supply;
import halfrail.design.Thresholds;
import halfrail.design.UsbPort;

import java.util.Map;

/**
 * Turns a {@link Design} into the JSON tree of a current-version design file. Quantities with a
 * unit are written as the shortest engineering text that reads back exactly ("4.7 kΩ"), the
 * others as JSON numbers; optional fields are left out when they hold their default and carry
 * nothing (no capacitor, zero ripple), so that reading the tree back gives an equal design.
 */
final class DesignFileWriter {
    private final JsonNodeFactory f = JsonNodeFactory.instance;

    ObjectNode write(Design d) {
        ObjectNode o = f.objectNode();
        o.put("format", DesignFiles.FORMAT_NAME);
        o.put("formatVersion", DesignFiles.FORMAT_VERSION);
        o.put("name", d.name());
        if (!d.description().isEmpty()) {
            o.put("description", d.description());
        }
        o.set("supply", supply(d.supply()));
        o.set("reference", reference(d.reference()));
        var stages = o.putArray("stages");
        for (Stage s : d.stages()) {
            stages.add(stage(s));
        }
        o.set("source", source(d.source()));
        o.set("load", load(d.load()));
        o.set("thresholds", thresholds(d.thresholds()));
        put(o, "powerOnRampSeconds", d.powerOnRampSeconds(), Quantity.SECONDS);
        return o;
    }

    private ObjectNode supply(Supply s) {
        ObjectNode o = f.objectNode();
        if (s instanceof CellPack c) {
            o.put("kind", DesignFormat.CELLS);
            o.put("chemistry", c.chemistry());
            o.put("cellsInSeries", c.cellsInSeries());
        } else if (s instanceof FixedRail r) {
            o.put("kind", DesignFormat.FIXED);
            put(o, "volts", r.volts(), Quantity.VOLTS);
            put(o, "tolerance", r.tolerance(), Quantity.FRACTION);
            ripple(o, r.rippleVoltsPeak(), r.rippleHz());
            if (Double.compare(r.sourceOhms(), 0.0) != 0) {
                put(o, "sourceOhms", r.sourceOhms(), Quantity.OHMS);
            }
        } else if (s instanceof UsbPort u) {
            o.put("kind", DesignFormat.USB);
            ripple(o, u.rippleVoltsPeak(), u.rippleHz());
        }
        return o;
    }

    private void ripple(ObjectNode o, double voltsPeak, double hz) {
        if (Double.compare(voltsPeak, 0.0) != 0) {
            put(o, "rippleVoltsPeak", voltsPeak, Quantity.VOLTS);
        }
        if (Double.compare(hz, 0.0) != 0) {
            put(o, "rippleHz", hz, Quantity.HERTZ);
        }
    }

    private ObjectNode reference(Reference r) {
        ObjectNode o = f.objectNode();
        o.put("kind", DesignFormat.REFERENCE_KINDS.get(r.kind()));
        put(o, "upperOhms", r.upperOhms(), Quantity.OHMS);
        put(o, "lowerOhms", r.lowerOhms(), Quantity.OHMS);
        boolean decoupled = r.kind() != ReferenceKind.DIVIDER_DIRECT;
        boolean buffered = r.kind() == ReferenceKind.DIVIDER_BUFFERED;
        if (r.decoupling() != null) {
            o.set("decoupling", capacitor(r.decoupling()));
        }
        if (decoupled || Double.compare(r.biasOhms(), 0.0) != 0) {
            put(o, "biasOhms", r.biasOhms(), Quantity.OHMS);
        }
        if (r.buffer() != null) {
            opAmp(o, "buffer", r.buffer());
        }
        if (buffered || Double.compare(r.isolationOhms(), 0.0) != 0) {
            put(o, "isolationOhms", r.isolationOhms(), Quantity.OHMS);
        }
        if (r.bufferDecoupling() != null) {
            o.set("bufferDecoupling", capacitor(r.bufferDecoupling()));
        }
        return o;
    }

    private ObjectNode stage(Stage s) {
        ObjectNode o = f.objectNode();
        o.put("name", s.name());
        o.put("kind", DesignFormat.STAGE_KINDS.get(s.kind()));
        opAmp(o, "opAmp", s.opAmp());
        boolean resistors = s.kind() != StageKind.FOLLOWER;
        if (resistors || Double.compare(s.feedbackOhms(), 0.0) != 0) {
            put(o, "feedbackOhms", s.feedbackOhms(), Quantity.OHMS);
        }
        if (resistors || Double.compare(s.legOhms(), 0.0) != 0) {
            put(o, "legOhms", s.legOhms(), Quantity.OHMS);
        }
        if (s.legCapacitor() != null) {
            o.set("legCapacitor", capacitor(s.legCapacitor()));
        }
        if (s.inputCapacitor() != null) {
            o.set("inputCapacitor", capacitor(s.inputCapacitor()));
        }
        if (!s.biased()) {
            o.put("biased", false);
        }
        return o;
    }

    private ObjectNode capacitor(CapacitorSpec c) {
        ObjectNode o = f.objectNode();
        put(o, "farads", c.farads(), Quantity.FARADS);
        o.put("technology", c.technology());
        put(o, "ratedVolts", c.ratedVolts(), Quantity.VOLTS);
        return o;
    }

    private void opAmp(ObjectNode owner, String field, OpAmpChoice choice) {
        if (choice.archetypeId().isPresent()) {
            owner.put(field, choice.archetypeId().get());
            return;
        }
        OpAmpParams p = choice.customParams().orElseThrow();
        double[] v = {p.openLoopGain(), p.gainBandwidthHz(), p.slewRateVoltsPerSecond(), p.offsetVolts(),
                p.biasAmps(), p.offsetCurrentAmps(), p.commonModeLowVolts(), p.commonModeHighVolts(),
                p.swingLowVolts(), p.swingHighVolts(), p.outputOhms(), p.quiescentAmps(), p.supplyMinVolts(),
                p.supplyMaxVolts()};
        ObjectNode o = owner.putObject(field);
        for (int i = 0; i < v.length; i++) {
            Map.Entry<String, Quantity> e = DesignFormat.OPAMP_FIELDS.get(i);
            boolean absentMeansThis = (e.getKey().equals("supplyMinVolts") && Double.compare(v[i], 0.0) == 0)
                    || (e.getKey().equals("supplyMaxVolts") && v[i] == Double.POSITIVE_INFINITY);
            if (!absentMeansThis) {
                put(o, e.getKey(), v[i], e.getValue());
            }
        }
    }

    private ObjectNode source(SignalSource s) {
        ObjectNode o = f.objectNode();
        Quantity q = switch (s.unit()) {
            case VOLTS_PEAK, VOLTS_RMS -> Quantity.VOLTS;
            case DBU, DBV -> Quantity.DECIBELS;
        };
        put(o, "amplitude", s.amplitude(), q);
        o.put("amplitudeUnit", DesignFormat.AMPLITUDE_UNITS.get(s.unit()));
        put(o, "sourceOhms", s.sourceOhms(), Quantity.OHMS);
        put(o, "bandLowHz", s.bandLowHz(), Quantity.HERTZ);
        put(o, "bandHighHz", s.bandHighHz(), Quantity.HERTZ);
        return o;
    }

    private ObjectNode load(Load l) {
        ObjectNode o = f.objectNode();
        put(o, "ohms", l.ohms(), Quantity.OHMS);
        if (Double.compare(l.farads(), 0.0) != 0) {
            put(o, "farads", l.farads(), Quantity.FARADS);
        }
        if (l.outputCapacitor() != null) {
            o.set("outputCapacitor", capacitor(l.outputCapacitor()));
        }
        return o;
    }

    private ObjectNode thresholds(Thresholds t) {
        double[] v = {t.settleBandFraction(), t.maxSettleSeconds(), t.minHeadroomDb(), t.offCentreDb(),
                t.nearRailFraction(), t.maxLeakageDriftVolts(), t.maxRippleVolts(), t.maxBiasShiftVolts(),
                t.maxStepVolts(), t.maxStageGain(), t.maxFeedbackOhms(), t.minRuntimeHours(),
                t.capacitorDeratingOverride()};
        ObjectNode o = f.objectNode();
        for (int i = 0; i < v.length; i++) {
            Map.Entry<String, Quantity> e = DesignFormat.THRESHOLD_FIELDS.get(i);
            put(o, e.getKey(), v[i], e.getValue());
        }
        return o;
    }

    /** Writes a quantity as engineering text where that reads back exactly, else as a JSON number. */
    private static void put(ObjectNode o, String field, double value, Quantity q) {
        String text = q.format(value);
        if (text != null) {
            o.put(field, text);
        } else {
            o.put(field, value);
        }
    }
}
