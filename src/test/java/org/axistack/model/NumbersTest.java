package org.axistack.model;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import org.junit.jupiter.api.Test;

/**
 * The one number formatter: plain rounding agrees with java.math.BigDecimal's own rounding (the JDK as the
 * reference library), zero trimming keeps the value, and a stack-file float reads back within its rounding.
 */
class NumbersTest {

    @Test
    void plainRoundsToSignificantDigitsWithoutExponent() {
        assertThat(Numbers.plain(0.000123456789, 5)).isEqualTo("0.00012346");
        assertThat(Numbers.plain(1599.7, 2)).isEqualTo("1600");
        assertThat(Numbers.plain(-161.28000000000003, Numbers.BIAS_DIGITS)).isEqualTo("-161.28");
        assertThat(Numbers.plain(-0.0, 4)).isEqualTo("0");
        assertThat(Numbers.plain(-1e-30, 4)).isEqualTo("-0.000000000000000000000000000001");
    }

    @Test
    void trimmingZerosKeepsTheValue() {
        java.util.Random rnd = new java.util.Random(7);
        for (int i = 0; i < 2000; i++) {
            double x = (rnd.nextDouble() - 0.5) * Math.pow(10, rnd.nextInt(30) - 15);
            for (int d = 2; d <= 8; d++) {
                String g = Numbers.general(x, d);
                String t = Numbers.trimZeros(g);
                assertThat(new BigDecimal(t).compareTo(new BigDecimal(g))).as(g + " -> " + t).isZero();
                assertThat(t).doesNotEndWith(".").doesNotContain(".e");
            }
        }
        assertThat(Numbers.trimZeros("1.2300e-05")).isEqualTo("1.23e-05");
        assertThat(Numbers.trimZeros("2.0")).isEqualTo("2");
        assertThat(Numbers.trimZeros("1.0e+10")).isEqualTo("1e+10");
    }

    @Test
    void aStackFileFloatReadsBackToTheSameDouble() {
        java.util.Random rnd = new java.util.Random(11);
        for (int i = 0; i < 5000; i++) {
            double x = (rnd.nextDouble() - 0.5) * Math.pow(10, rnd.nextInt(12) - 6);
            // rounding to 15 significant digits errs by at most half a unit in the 15th digit (5e-15 relative),
            // and parsing back adds at most half an ulp of a double (1.1e-16 relative, IEEE 754)
            double back = Double.parseDouble(Numbers.plain(x, Numbers.TOML_DIGITS));
            assertThat(Math.abs(back - x)).isLessThanOrEqualTo((5e-15 + 2.3e-16) * Math.abs(x));
        }
    }

    /** Estimates keep their size to one decimal; a parse round trip is within half a unit of that decimal. */
    @Test
    void estimatesTolerancesAndSecondsHaveOneStyleEach() {
        assertThat(Numbers.estimate(3.8249e-8)).isEqualTo("3.8e-08");
        assertThat(Numbers.tolerance(1e-5)).isEqualTo("1e-05");
        assertThat(Numbers.seconds(0.2849)).isEqualTo("0.28");
        java.util.Random rnd = new java.util.Random(5);
        for (int i = 0; i < 2000; i++) {
            double x = rnd.nextDouble() * Math.pow(10, -rnd.nextInt(15));
            double back = Double.parseDouble(Numbers.estimate(x));
            // one decimal of the mantissa: the rounding error is at most 0.05 of the leading power of ten
            assertThat(Math.abs(back - x)).isLessThanOrEqualTo(0.05 * Math.pow(10, Math.floor(Math.log10(x))) * (1 + 1e-12));
        }
    }
}
