package halfrail.cli;

import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.DesignCircuits;
import halfrail.design.DesignException;
import halfrail.io.Netlist;
import halfrail.io.NetlistException;
import halfrail.io.NetlistReader;
import halfrail.io.NetlistWriter;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;

/**
 * {@code netlist FILE}: writes a design file's circuit (at the nominal supply, typical leakage)
 * as a netlist, or reads a netlist and writes it normalised (one element per line, values with
 * scale suffixes, one {@code .model} per parameter set).
 */
@Command(name = "netlist", mixinStandardHelpOptions = true,
        description = "Write a design file's circuit, or a netlist normalised, as a netlist on standard output.")
public final class NetlistCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "FILE", description = "A design file (*.json) or a netlist.")
    Path file;

    @Override
    public Integer call() {
        String text;
        try {
            if (CheckCommand.isDesignFile(file)) {
                Design design = CheckCommand.readDesign(file);
                DesignCircuit dc;
                try {
                    dc = DesignCircuits.nominal(design);
                } catch (DesignException e) {
                    throw new BadInputException(file + ": " + e.getMessage());
                }
                text = NetlistWriter.write(new Netlist(dc.circuit(), Optional.of(dc.loadNode()), List.of(),
                        List.of(), java.util.Map.of()));
            } else {
                text = NetlistWriter.write(NetlistReader.read(file));
            }
        } catch (NetlistException e) {
            throw new BadInputException(file + ": " + e.getMessage());
        }
        PrintWriter out = spec.commandLine().getOut();
        out.print(text);
        out.flush();
        return ExitCodes.PASS;
    }
}
