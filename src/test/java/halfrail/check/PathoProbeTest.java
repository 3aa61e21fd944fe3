package halfrail.check;

import org.junit.jupiter.api.Test;

class PathoProbeTest {
    @Test
    void probe() {
        PathologicalValuesTest.cases().forEach(c -> {
            try {
                DesignReport r = DesignAnalysis.analyse(c.change().apply(TestDesigns.healthyNineVolt()));
                System.out.println("PATHO " + c.name() + " failure=" + r.failure() + " " + r.failureMessage());
                r.findings().forEach(f -> System.out.println("PATHO   " + f.code() + " " + f.severity() + " " + f.message()));
                r.stages().forEach(s -> System.out.println("PATHO   stage " + s));
                r.powerOn().ifPresent(p -> System.out.println("PATHO   powerOn " + p));
                r.chain().ifPresent(p -> System.out.println("PATHO   chain " + p));
            } catch (RuntimeException e) {
                System.out.println("PATHO " + c.name() + " threw " + e);
            }
        });
    }
}
