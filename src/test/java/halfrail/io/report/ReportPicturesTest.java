package halfrail.io.report;

import halfrail.check.DesignReport;
import org.junit.jupiter.api.Test;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ReportPicturesTest {
    @Test
    void samplePicturesAreWrittenForAPersonToLookAt() throws IOException {
        for (Path f : SampleReports.designFiles()) {
            DesignReport r = SampleReports.report(f);
            String base = f.getFileName().toString().replace(".json", "");
            if (!r.ladders().isEmpty()) {
                write(base + "-ladder.png", ReportPictures.png(ReportPictures.ladders(r.ladders(), r.findings())));
            }
            if (r.powerOn().flatMap(p -> p.trace()).isPresent()) {
                write(base + "-power-on.png", ReportPictures.png(ReportPictures.powerOn(r.powerOn().get(),
                        r.design().supply().nominalVolts())));
            }
            if (r.chain().filter(c -> !c.responses().isEmpty()).isPresent()) {
                write(base + "-response.png", ReportPictures.png(ReportPictures.response(r.chain().get())));
            }
        }
    }

    private static void write(String name, byte[] png) throws IOException {
        BufferedImage back = ImageIO.read(new ByteArrayInputStream(png));
        assertTrue(back.getWidth() > 0, name + " reads back as a PNG");
        Files.write(SampleReports.outputDir().resolve(name), png);
    }
}
