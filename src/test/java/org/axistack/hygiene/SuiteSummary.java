package org.axistack.hygiene;

import java.io.PrintStream;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.platform.engine.TestExecutionResult;
import org.junit.platform.launcher.TestExecutionListener;
import org.junit.platform.launcher.TestIdentifier;
import org.junit.platform.launcher.TestPlan;

/**
 * One summary line at the end of the test run, also under {@code mvn -q} (which hides Maven's own summary):
 * how many tests passed, failed and were skipped, with the reasons for the skips (no display, screenshots not
 * asked for...). Registered in {@code META-INF/services/org.junit.platform.launcher.TestExecutionListener}.
 * Written to the standard error stream of the test JVM, which the build shows while the tests' own output goes
 * to target/surefire-reports.
 */
public final class SuiteSummary implements TestExecutionListener {

    private final AtomicInteger passed = new AtomicInteger();
    private final AtomicInteger failed = new AtomicInteger();
    private final Map<String, Integer> skipped = new TreeMap<>();

    @Override
    public void executionSkipped(TestIdentifier id, String reason) {
        synchronized (skipped) {
            skipped.merge(reason == null ? "disabled" : reason, 1, Integer::sum);
        }
    }

    @Override
    public void executionFinished(TestIdentifier id, TestExecutionResult result) {
        if (!id.isTest()) {
            return;
        }
        switch (result.getStatus()) {
            case SUCCESSFUL -> passed.incrementAndGet();
            case FAILED -> failed.incrementAndGet();
            case ABORTED -> executionSkipped(id, result.getThrowable().map(Throwable::getMessage)
                    .map(m -> m.replaceFirst("^Assumption failed: ", "")).orElse("assumption not met"));
        }
    }

    @Override
    public void testPlanExecutionFinished(TestPlan plan) {
        print(new PrintStream(new java.io.FileOutputStream(java.io.FileDescriptor.err), true));
    }

    void print(PrintStream out) {
        StringBuilder b = new StringBuilder("axistack tests: ").append(passed.get()).append(" passed, ")
                .append(failed.get()).append(" failed");
        synchronized (skipped) {
            int n = skipped.values().stream().mapToInt(Integer::intValue).sum();
            b.append(", ").append(n).append(" skipped");
            if (n > 0) {
                b.append(" (");
                String sep = "";
                for (Map.Entry<String, Integer> e : skipped.entrySet()) {
                    b.append(sep).append(e.getValue()).append(": ").append(e.getKey());
                    sep = "; ";
                }
                b.append(')');
            }
        }
        out.println(b);
        out.flush();
    }
}
