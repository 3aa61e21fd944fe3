package halfrail.cli;

import halfrail.io.NetlistException;
import halfrail.io.SpiceValues;
import picocli.CommandLine;

/** Reads option values in the SPICE value form ({@code 1m}, {@code 10u}, {@code 0.05}). */
final class SpiceValueConverter implements CommandLine.ITypeConverter<Double> {
    @Override
    public Double convert(String value) {
        try {
            return SpiceValues.parse(value);
        } catch (NetlistException e) {
            throw new CommandLine.TypeConversionException(e.getMessage());
        }
    }
}
