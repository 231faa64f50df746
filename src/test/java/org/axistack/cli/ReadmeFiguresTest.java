package org.axistack.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.axistack.cli.CliRun.Run;
import org.axistack.io.BuiltInStacks;
import org.axistack.model.Electrode;
import org.axistack.model.Stack;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The README's worked example ("Tuning on the bench") says what the program computes: this test reads the
 * figures and the command lines from the README itself, runs those commands (with --json) and checks that each
 * figure is the computed value rounded as the README prints it. README and code must agree; when a change in
 * the physics moves a figure, change the README (one place holds each number). The checks are of the README's
 * own consistency with the code, not of the physics (the tune tests do that against closed forms).
 */
class ReadmeFiguresTest {

    private static final String PREFIX = "java -jar target/axistack.jar ";
    private static final ObjectMapper JSON = new ObjectMapper();

    private static String text;
    private static List<String[]> commands;

    @BeforeAll
    static void readTheReadme() throws Exception {
        String readme = Files.readString(Path.of("README.md"));
        int start = readme.indexOf("## Tuning on the bench");
        assertThat(start).as("README section 'Tuning on the bench'").isNotNegative();
        int end = readme.indexOf("\n## ", start + 1);
        text = readme.substring(start, end < 0 ? readme.length() : end);
        commands = new ArrayList<>();
        for (String line : text.split("\n")) {
            if (line.startsWith("    " + PREFIX + "tune ")) {
                commands.add(line.substring(4 + PREFIX.length()).trim().split("\\s+"));
            }
        }
        assertThat(commands).as("tune command lines in the README section").hasSize(2);
    }

    @Test
    void theDemoAtItsStoredBiasFocusesWhereTheReadmeSays() throws Exception {
        Matcher m = find("at its stored (-?\\d+) V brings a parallel beam to a focus at about (\\d+\\.\\d+) mm, past\\s+"
                + "its (\\d+) mm screen");
        Stack demo = BuiltInStacks.demo();
        Electrode focus = demo.electrodes().stream().filter(e -> e.name().equals("focus")).findFirst().orElseThrow();
        assertThat(focus.bias_V()).isEqualTo(Double.parseDouble(m.group(1)));
        assertThat(demo.screenZ_m().getAsDouble() * 1e3).isEqualTo(Double.parseDouble(m.group(3)));
        Path file = Path.of("lens-library", BuiltInStacks.DEMO_FILE);
        assertThat(Files.readString(file)).as("the library copy of the demo").isEqualTo(BuiltInStacks.demoText());
        JsonNode optics = json("optics", file.toString());
        assertRounded(m.group(2), optics.get("real_focus_image_z_mm").asDouble(), "focus of the parallel beam, mm");
    }

    @Test
    void theOneElectrodeTuneGivesTheReadmesBiasesAndSupplyBudget() throws Exception {
        JsonNode tune = json(commands.get(0));
        JsonNode dec = solution(tune, "decelerating");
        JsonNode acc = solution(tune, "accelerating");

        Matcher d = find("the decelerating one at about (-?\\d+\\.\\d+) V \\(f2 = (\\d+\\.\\d+) mm\\)");
        assertRounded(d.group(1), dec.get("bias_V").asDouble(), "decelerating bias, V");
        assertRounded(d.group(2), dec.get("focal_length_image_mm").asDouble(), "decelerating f2, mm");

        Matcher a = find("the accelerating one at about \\+?(\\d+\\.\\d+) V \\(f2 = (\\d+\\.\\d+) mm\\)");
        assertRounded(a.group(1), acc.get("bias_V").asDouble(), "accelerating bias, V");
        assertRounded(a.group(2), acc.get("focal_length_image_mm").asDouble(), "accelerating f2, mm");

        Matcher n = find("and (\\w+) close to the\\s+mirror limit near (-\\d+) V");
        List<Double> nearMirror = new ArrayList<>();
        for (JsonNode s : tune.get("solutions")) {
            if (s.get("axis_crossings_before_image").asInt() > 0) {
                nearMirror.add(s.get("bias_V").asDouble());
            }
        }
        assertThat(nearMirror).hasSize(Arrays.asList("zero", "one", "two", "three", "four").indexOf(n.group(1)));
        // "near": within 2 V of the README's round figure (the two lie 1.3 V apart)
        assertThat(nearMirror).allSatisfy(v -> assertThat(Math.abs(v - Double.parseDouble(n.group(2)))).isLessThan(2));

        Matcher s = find("For (-?\\d+\\.\\d+) V the image moves (\\d+\\.\\d+) mm per volt, so holding the focus within\\s+"
                + "\\+/- (\\d+\\.\\d+) mm needs a\\s+supply stable to about (\\d+) ppm \\((\\d+\\.\\d+) V\\)");
        assertRounded(s.group(1), dec.get("bias_V").asDouble(), "bias of the budget, V");
        assertRounded(s.group(2), dec.get("image_shift_mm_per_V").get("focus").asDouble(), "image shift, mm/V");
        assertThat(tune.get("depth_mm").asDouble()).isEqualTo(Double.parseDouble(s.group(3)));
        double ppm = dec.get("supply_stability_ppm").get("focus").asDouble();
        assertRounded(s.group(4), ppm, "supply stability, ppm");
        assertRounded(s.group(5), ppm * 1e-6 * Math.abs(dec.get("bias_V").asDouble()), "supply stability, V");
        find("the beam energy needs the same relative stability");
        assertRounded(s.group(4), dec.get("energy_stability_ppm").asDouble(), "beam energy stability, ppm");

        Matcher r = find("accelerating solution is about (\\d+\\.\\d+) times less touchy but needs (\\d+\\.\\d+) times the voltage");
        assertRounded(r.group(1), acc.get("supply_stability_ppm").get("focus").asDouble() / ppm, "ppm ratio");
        assertRounded(r.group(2), acc.get("bias_V").asDouble() / Math.abs(dec.get("bias_V").asDouble()), "bias ratio");
        assertThat(acc.get("max_surface_field_V_per_mm").asDouble())
                .as("'and a higher surface field'").isGreaterThan(dec.get("max_surface_field_V_per_mm").asDouble());
    }

    @Test
    void theTwoElectrodeTuneGivesTheReadmesPair() throws Exception {
        JsonNode tune = json(commands.get(1));
        Matcher m = find("finds focus = (-?\\d+\\.\\d+) V with outlet = \\+?(-?\\d+\\.\\d+) V");
        JsonNode first = tune.get("solutions").get(0);
        assertThat(first.get("image_z_mm").asDouble()).isEqualTo(35.0, within(1e-6));
        assertRounded(m.group(1), first.get("biases_V").get("focus").asDouble(), "focus, V");
        assertRounded(m.group(2), first.get("biases_V").get("outlet").asDouble(), "outlet, V");
    }

    private static JsonNode solution(JsonNode tune, String mode) {
        for (JsonNode s : tune.get("solutions")) {
            if (s.get("mode").asText().equals(mode) && s.get("axis_crossings_before_image").asInt() == 0) {
                return s;
            }
        }
        throw new AssertionError("no " + mode + " solution without axis crossings in " + tune);
    }

    private static Matcher find(String regex) {
        Matcher m = Pattern.compile(regex).matcher(text.replaceAll("\\s+", " ")); // line breaks are spaces
        assertThat(m.find()).as("README 'Tuning on the bench' says: " + regex).isTrue();
        return m;
    }

    /** The README's figure equals the computed value rounded half-up to the README's number of decimals. */
    private static void assertRounded(String readme, double computed, String what) {
        BigDecimal shown = new BigDecimal(readme);
        BigDecimal rounded = BigDecimal.valueOf(computed).setScale(Math.max(shown.scale(), 0), RoundingMode.HALF_UP);
        assertThat(rounded).as("%s: the README says %s, the program computes %s", what, readme, computed)
                .isEqualByComparingTo(shown);
    }

    private static JsonNode json(String... args) throws Exception {
        String[] withJson = Arrays.copyOf(args, args.length + 1);
        withJson[args.length] = "--json";
        Run r = CliRun.run(withJson);
        assertThat(r.code()).as(String.join(" ", withJson) + "\n" + r.err()).isZero();
        return JSON.readTree(r.out());
    }
}
