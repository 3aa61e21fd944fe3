package halfrail.cli;

import halfrail.io.NetlistException;
import halfrail.io.NetlistReader;
import halfrail.io.NetlistWriter;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;

/**
 * {@code netlist FILE}: reads a netlist and writes it normalised (one element per line, values
 * with scale suffixes, one {@code .model} per parameter set). Design files come later.
 */
@Command(name = "netlist", mixinStandardHelpOptions = true,
        description = "Read a netlist and write it normalised to standard output.")
public final class NetlistCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "FILE", description = "A netlist file.")
    Path file;

    @Override
    public Integer call() {
        String text;
        try {
            text = NetlistWriter.write(NetlistReader.read(file));
        } catch (NetlistException e) {
            throw new BadInputException(file + ": " + e.getMessage());
        }
        PrintWriter out = spec.commandLine().getOut();
        out.print(text);
        out.flush();
        return ExitCodes.PASS;
    }
}
