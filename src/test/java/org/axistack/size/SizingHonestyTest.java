package org.axistack.size;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;

import org.axistack.field.BemSolver;
import org.axistack.field.SolveProgress;
import org.axistack.io.StackReader;
import org.axistack.io.StackWriter;
import org.axistack.model.MeshSettings;
import org.axistack.model.Stack;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.OpticsAccuracy;
import org.axistack.optics.ParaxialOptics;
import org.axistack.tune.GapMargins;
import org.junit.jupiter.api.Test;

/**
 * Sizing honesty (issue 19 item 5): what size says of a design's accuracy is what plan will say of the written
 * stack. The reference is the stack written as a file and read back, solved afresh, with the plan's own accuracy
 * and gap statements (a consistency check between the two commands, no external source).
 */
class SizingHonestyTest {

    @Test
    void theDesignsWarningsAreThoseOfItsWrittenStack() throws Exception {
        Requirements r = FocusConditionTest.immersion(OptionalDouble.of(0.08), OptionalDouble.empty());
        DesignEvaluator ev = new DesignEvaluator(r, new TunerFocusFinder(12));
        DesignEvaluator.Candidate c = ev.evaluate(new double[] {0.004, 0.002, 0.03, 0.001}, 150, SolveProgress.NONE);
        assertThat(c.designs()).isNotEmpty();
        for (Design d : c.designs()) {
            Stack stack = ev.stack(d.electrodes(), MeshSettings.defaults().withTargetElements(150));
            Stack written = StackReader.parse(StackWriter.toToml(stack), "chosen.toml");
            CardinalElements card = ParaxialOptics.of(BemSolver.solve(written.electrodes(), written.mesh(),
                    SolveProgress.NONE).withBiases(written.biases_V()), written).cardinal();
            List<String> plan = new ArrayList<>();
            OpticsAccuracy.shortfall(card, OpticsAccuracy.DEFAULT_REQUESTED).ifPresent(plan::add);
            OpticsAccuracy.closeTheLens(card).ifPresent(plan::add);
            GapMargins.of(written).stream().map(GapMargins::warning).filter(w -> w != null).forEach(plan::add);
            System.out.printf("design at %.1f V: error %.2e, far-field share %.2e, warnings %s%n", d.bias_V(),
                    d.opticsError(), card.farFieldShare(), d.planWarnings());
            assertThat(d.planWarnings()).isEqualTo(plan);
            assertThat(d.opticsError()).isCloseTo(card.errorEstimate(), org.assertj.core.api.Assertions.withinPercentage(0.1));
        }
    }
}
