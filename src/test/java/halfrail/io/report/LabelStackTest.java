package halfrail.io.report;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.Size;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Label placement beside a ladder (common practice: labels keep their order and never overlap). */
class LabelStackTest {
    @Test
    void labelsAlreadyApartStayWhereTheyPoint() {
        double[] wanted = {300, 100, 200};
        assertArrayEquals(wanted, LabelStack.spread(wanted, 14, 0, 500), 1e-12);
    }

    @Test
    void twoCrowdedLabelsMoveApartAroundTheirMiddle() {
        double[] placed = LabelStack.spread(new double[] {100, 104}, 14, 0, 500);
        assertEquals(95, placed[0], 1e-9);
        assertEquals(109, placed[1], 1e-9);
    }

    @Test
    void labelsCrowdedAtTheBottomArePushedUpInsideTheDrawing() {
        double[] placed = LabelStack.spread(new double[] {498, 499, 500}, 14, 0, 500);
        assertEquals(500, placed[2], 1e-9);
        assertEquals(472, placed[0], 1e-9);
    }

    @Property(tries = 200, seed = "174545027661584")
    void placedLabelsKeepTheirOrderAndTheirGap(@ForAll @Size(min = 1, max = 14) List<@DoubleRange(min = 0, max = 400) Double> ys) {
        double[] wanted = ys.stream().mapToDouble(Double::doubleValue).toArray();
        double[] placed = LabelStack.spread(wanted, 14, 0, 400);
        for (int i = 0; i < wanted.length; i++) {
            for (int j = 0; j < wanted.length; j++) {
                if (wanted[i] < wanted[j]) {
                    assertTrue(placed[j] - placed[i] >= 14 - 1e-6, "gap and order kept");
                }
            }
        }
    }
}
