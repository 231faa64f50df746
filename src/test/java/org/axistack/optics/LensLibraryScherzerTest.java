package org.axistack.optics;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

import org.axistack.field.BiasedField;
import org.axistack.model.Stack;
import org.axistack.testing.LibrarySolutions;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Scherzer's theorem (O. Scherzer, Z. Physik 101, 593 (1936)): a static round lens free of space charge has
 * positive spherical and chromatic aberration coefficients. Checked on every stack of the lens library with
 * the aberration integrals, in the convention of interface.md (image side for a parallel beam, object side
 * too for a finite object), at the stack's own biases.
 */
class LensLibraryScherzerTest {

    static Stream<Path> library() throws IOException {
        try (Stream<Path> files = Files.list(Path.of("lens-library"))) {
            return files.filter(p -> p.toString().endsWith(".toml")).sorted().toList().stream();
        }
    }

    @ParameterizedTest
    @MethodSource("library")
    void everyLibraryLensHasPositiveCsAndCc(Path file) throws Exception {
        LibrarySolutions.Solved solved = LibrarySolutions.of(file);
        Stack stack = solved.stack();
        BiasedField field = solved.solution().biased();
        ParaxialOptics optics = ParaxialOptics.of(field, stack);
        // a strong lens may cross the axis inside its field and look diverging asymptotically (the retarding
        // analyser lens does): the theorem still holds for its coefficients; only an afocal lens has none
        assertThat(optics.cardinal().kind()).as("%s has a focus", file).isNotEqualTo(CardinalElements.Kind.AFOCAL);
        // issue 23: the error estimate is below 1e-5 of f, or the output says why not; the reason it gives must be
        // the one that dominates the estimate (a tube plane whose field has not died away)
        CardinalElements c = optics.cardinal();
        System.out.printf("%s: ends %s / %s, error estimate %.2e, far-field share %.2e, plane sensitivity %.2e%n",
                file.getFileName(), c.objectEnd().rule().key(), c.imageEnd().rule().key(), c.errorEstimate(),
                c.farFieldShare(), c.planeSensitivity());
        if (!(c.errorEstimate() < OpticsAccuracy.DEFAULT_REQUESTED)) {
            assertThat(c.planeSensitivity()).as("%s: the estimate comes from an ended tube plane", file)
                    .isEqualTo(c.errorEstimate());
            assertThat(OpticsAccuracy.shortfall(c, OpticsAccuracy.DEFAULT_REQUESTED)).as("%s says why", file).get()
                    .asString().contains("drift tube").contains(String.format(java.util.Locale.ROOT, "%.1e", c.errorEstimate()));
        }
        Aberrations a = optics.aberrations();
        System.out.printf("%s (%s): Cs %.6g mm, Cc %.6g mm (image side)%n", file.getFileName(), optics.cardinal().kind(),
                a.sphericalImage_m() * 1e3, a.chromaticImage_m() * 1e3);
        assertThat(a.sphericalImage_m()).as("Cs of %s", file).isPositive();
        assertThat(a.chromaticImage_m()).as("Cc of %s", file).isPositive();
        if (stack.beam().objectZ_m().isPresent()) {
            Aberrations o = optics.aberrations(stack.beam().objectZ_m().getAsDouble());
            assertThat(o.sphericalObject_m().getAsDouble()).as("object-side Cs of %s", file).isPositive();
            assertThat(o.chromaticObject_m().getAsDouble()).as("object-side Cc of %s", file).isPositive();
        }
    }
}
