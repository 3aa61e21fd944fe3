package halfrail;

import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The launcher in a process of its own, as a pipeline runs it. */
class MainTest {
    @Test
    void aCommandRunsHeadlessAndNeverLoadsTheUiToolkit() throws IOException, InterruptedException {
        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        ProcessBuilder pb = new ProcessBuilder(List.of(java.toString(), "-verbose:class", "-Djava.awt.headless=true",
                "-cp", System.getProperty("java.class.path"), "halfrail.Main", "check", "--format", "json",
                "samples/usb-line-driver.json"));
        pb.environment().remove("DISPLAY");
        pb.redirectErrorStream(true);
        Process p = pb.start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(120, TimeUnit.SECONDS), "the check finishes");
        assertEquals(0, p.exitValue(), out.lines().filter(l -> !l.startsWith("[")).toList().toString());
        assertTrue(out.contains("\"verdict\" : \"pass\""), "the JSON report is printed");
        List<String> loaded = out.lines().filter(l -> l.startsWith("[") && l.contains("javafx.")).toList();
        assertTrue(loaded.isEmpty(), () -> "JavaFX classes were loaded: " + loaded.subList(0, Math.min(5, loaded.size())));
        assertFalse(out.contains("halfrail.ui."), "no UI class is loaded");
    }

    @Test
    void oneExistingDesignFileAloneOpensTheAppAndEverythingElseIsACommand() {
        assertTrue(Main.opensADesign(new String[] {"samples/usb-line-driver.json"}));
        assertFalse(Main.opensADesign(new String[] {"check", "samples/usb-line-driver.json"}));
        assertFalse(Main.opensADesign(new String[] {"samples/nine-volt-boost.cir"}));
        assertFalse(Main.opensADesign(new String[] {"samples/no-such-design.json"}));
        assertFalse(Main.opensADesign(new String[] {"--help"}));
    }

    @Test
    void theAppAndTheCommandLineGiveTheSameVersion() {
        assertEquals(halfrail.cli.HalfrailCommand.VERSION, halfrail.ui.HalfrailApp.VERSION);
    }
}
