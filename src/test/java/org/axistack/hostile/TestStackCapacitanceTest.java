package org.axistack.hostile;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

import org.axistack.field.BemSolver;
import org.axistack.field.CapacitanceCheck;
import org.axistack.field.SolveProgress;
import org.axistack.io.StackReader;
import org.axistack.model.Stack;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Issue 24's check on the stacks we ship and test with: the capacitance matrix of every stack file of lens-library/
 * (the built-in demo is a byte copy of one) and of the test resources is symmetric to 1e-6 of sqrt(C_ii C_jj) and
 * has no positive off-diagonal term (reciprocity and the sign law; J. D. Jackson, Classical Electrodynamics, 3rd
 * ed., sec. 1.13), on each file's own mesh. Stacks built in code are held to the same law by the solver itself
 * (it refuses a broken matrix) and by the property tests.
 */
class TestStackCapacitanceTest {

    static Stream<Path> stackFiles() throws IOException {
        try (Stream<Path> lib = Files.list(Path.of("lens-library"));
                Stream<Path> res = Files.walk(Path.of("src/test/resources"))) {
            return Stream.concat(lib.toList().stream(), res.toList().stream())
                    .filter(p -> p.toString().endsWith(".toml")).sorted();
        }
    }

    @ParameterizedTest
    @MethodSource("stackFiles")
    void capacitanceMatrixIsSymmetricWithNonPositiveMutualTerms(Path file) throws Exception {
        Stack s = StackReader.read(file);
        CapacitanceCheck c = BemSolver.solve(s.electrodes(), s.mesh(), SolveProgress.NONE).capacitanceCheck();
        assertThat(c.asymmetry()).as("asymmetry of %s", file).isLessThanOrEqualTo(CapacitanceCheck.WARN_ASYMMETRY);
        assertThat(c.offDiagonal()).as("largest mutual term of %s", file).isLessThanOrEqualTo(0);
        assertThat(c.warned()).isFalse();
    }
}
