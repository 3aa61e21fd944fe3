package halfrail.cli;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

import java.util.concurrent.Callable;

/**
 * The top command {@code halfrail}. Run {@link #newCommandLine()}{@code .execute(args)}: it never
 * throws and returns one of {@link ExitCodes}. Bad input prints one line on the error writer,
 * never a stack trace.
 */
@Command(name = "halfrail", mixinStandardHelpOptions = true, versionProvider = HalfrailCommand.Version.class,
        description = "Checks op-amp stages that run from one supply rail.",
        subcommands = {CheckCommand.class, NetlistCommand.class, ConvertCommand.class, ReportCommand.class})
public final class HalfrailCommand implements Callable<Integer> {
    /** The program version. */
    public static final String VERSION = "0.1.0-SNAPSHOT";

    @Spec
    CommandSpec spec;

    /** Supplies {@link #VERSION} to {@code --version}. */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"halfrail " + VERSION};
        }
    }

    /** Without a command: the usage on the error writer, and {@link ExitCodes#BAD_INPUT}. */
    @Override
    public Integer call() {
        spec.commandLine().usage(spec.commandLine().getErr());
        spec.commandLine().getErr().flush();
        return ExitCodes.BAD_INPUT;
    }

    /** A command line with Halfrail's exit codes and one-line error handling. */
    public static CommandLine newCommandLine() {
        CommandLine cl = new CommandLine(new HalfrailCommand());
        cl.setCaseInsensitiveEnumValuesAllowed(true);
        cl.setParameterExceptionHandler((ex, args) -> {
            CommandLine c = ex.getCommandLine();
            c.getErr().println(c.getCommandSpec().qualifiedName() + ": " + oneLine(ex.getMessage())
                    + " (see --help)");
            c.getErr().flush();
            return ExitCodes.BAD_INPUT;
        });
        cl.setExecutionExceptionHandler((ex, c, parseResult) -> {
            if (ex instanceof BadInputException) {
                c.getErr().println(oneLine(ex.getMessage()));
                c.getErr().flush();
                return ExitCodes.BAD_INPUT;
            }
            c.getErr().println(c.getCommandSpec().qualifiedName() + ": internal error: "
                    + ex.getClass().getSimpleName() + (ex.getMessage() == null ? "" : ": " + oneLine(ex.getMessage())));
            c.getErr().flush();
            return ExitCodes.INTERNAL_ERROR;
        });
        return cl;
    }

    private static String oneLine(String s) {
        return s == null ? "" : s.replaceAll("[\\r\\n]+", " ").strip();
    }
}
