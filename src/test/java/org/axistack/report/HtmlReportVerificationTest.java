package org.axistack.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import org.axistack.verify.CheckResult;
import org.junit.jupiter.api.Test;

/** The report's verification table shows each case's numbers and source, and marks a failed case. */
class HtmlReportVerificationTest {

    @Test
    void tableShowsValuesSourcesAndFailures() {
        CheckResult ok = new CheckResult("sphere capacitance", "C", "pF", 2.2253001, 2.2253001, 1e-13, 1e-9, "relative",
                "C = 4 pi eps0 R <classical>", "96 unknowns", 0.1);
        CheckResult bad = new CheckResult("made-up case", "x", "V", 1.5, 1.0, 0.5, 1e-3, "relative", "none", "m", 0.1);
        StringBuilder b = new StringBuilder();
        HtmlReport.verification(b, List.of(ok, bad));
        String html = b.toString();
        assertThat(html).contains("<td>sphere capacitance</td>", "<td>2.22530</td>", "C = 4 pi eps0 R &lt;classical&gt;",
                "<td class=\"over\">FAIL</td>", "<td class=\"over\">5.00e-01</td>", "1 of 2 cases within tolerance");
    }
}
