package org.axistack.verify;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Values once written down from memory, against the file that src/test/resources/reference/recompute.py writes
 * with mpmath at 40 digits (a general-purpose arbitrary-precision library; see the README there): erfi(1) and
 * the 12-point Gauss-Legendre rule of {@link TwoTubeBesselPotential}.
 */
class ReferenceValuesTest {

    private static final Map<String, List<Double>> VALUES = read();

    @Test
    void erfiOfOne() {
        assertThat(Erfi.erfi(1.0)).isCloseTo(value("erfi", 0), within(1e-14));
    }

    @Test
    void gaussLegendreNodesAndWeightsOfTheTwoTubeReference() {
        List<Double> nodes = VALUES.get("gauss_legendre_12_node");
        List<Double> weights = VALUES.get("gauss_legendre_12_weight");
        assertThat(nodes).hasSize(TwoTubeBesselPotential.GL_X.length);
        assertThat(weights).hasSize(TwoTubeBesselPotential.GL_W.length);
        for (int i = 0; i < nodes.size(); i++) {
            assertThat(TwoTubeBesselPotential.GL_X[i]).as("node %d", i).isCloseTo(nodes.get(i), within(2e-16));
            assertThat(TwoTubeBesselPotential.GL_W[i]).as("weight %d", i).isCloseTo(weights.get(i), within(2e-16));
        }
    }

    private static double value(String name, int index) {
        List<Double> v = VALUES.get(name);
        assertThat(v).as(name).isNotNull();
        return v.get(index);
    }

    private static Map<String, List<Double>> read() {
        Map<String, List<Double>> m = new LinkedHashMap<>();
        try (InputStream in = ReferenceValuesTest.class.getResourceAsStream("/reference/values.tsv")) {
            if (in == null) {
                throw new IllegalStateException("src/test/resources/reference/values.tsv is missing");
            }
            for (String line : new String(in.readAllBytes(), StandardCharsets.UTF_8).split("\n")) {
                if (line.isBlank() || line.startsWith("#") || line.startsWith("name\t")) {
                    continue;
                }
                String[] f = line.split("\t");
                List<Double> list = m.computeIfAbsent(f[0], k -> new ArrayList<>());
                assertThat(Integer.parseInt(f[1])).as("index order in values.tsv").isEqualTo(list.size());
                list.add(Double.parseDouble(f[2]));
            }
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
        return m;
    }
}
