package org.axistack.ui;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

import org.jfree.chart.ChartPanel;

/**
 * The lens-view chart panel, which also times every bias change from the change to the end of the next paint,
 * split into its phases (for the measured figures in src/site/markdown/gui.md and the window's status bar).
 */
final class TimedChartPanel extends ChartPanel {

    /**
     * One change-to-redraw, ms.
     *
     * @param total_ms      from the change (event thread) to the end of the next paint of the lens view
     * @param wait_ms       from the change until the live worker started on it
     * @param compute_ms    the view computation on the worker, wall clock
     * @param computeCpu_ms the view computation, processor time of the worker thread
     * @param handoff_ms    from the end of the computation until the event thread installed the layers
     * @param toPaint_ms    from installing the layers until the paint began
     * @param paint_ms      the paint of the lens view, wall clock
     * @param paintCpu_ms   the paint, processor time of the event thread
     */
    record Redraw(double total_ms, double wait_ms, double compute_ms, double computeCpu_ms, double handoff_ms,
            double toPaint_ms, double paint_ms, double paintCpu_ms) {
    }

    private static final ThreadMXBean THREADS = ManagementFactory.getThreadMXBean();

    private volatile long changeNanos;
    private long startNanos;
    private long computedNanos;
    private double computeCpuMs;
    private long appliedNanos;
    private final List<Redraw> redraws = Collections.synchronizedList(new ArrayList<>());
    private Runnable afterPaint = () -> { };
    private Runnable afterEveryPaint = () -> { };

    TimedChartPanel() {
        super(null, 900, 600, 300, 200, 2400, 1800, true, true, true, true, true, false);
        setName("lens-view");
        // no per-item entities (thousands of line pieces): the read-out only needs the plot areas
        getChartRenderingInfo().setEntityCollection(null);
    }

    /** A bias changed now (event thread). */
    void markChange(long nanos) {
        changeNanos = nanos;
    }

    /** The event thread installs a view computed from startNanos to endNanos with this processor time. */
    void markApplied(long startNanos, long endNanos, double cpuMs) {
        this.startNanos = startNanos;
        this.computedNanos = endNanos;
        this.computeCpuMs = cpuMs;
        this.appliedNanos = System.nanoTime();
    }

    /** Runs r on the event thread after each timed redraw. */
    void afterPaint(Runnable r) {
        afterPaint = r;
    }

    /** Runs r on the event thread after every paint. */
    void afterEveryPaint(Runnable r) {
        afterEveryPaint = r;
    }

    @Override
    public void paintComponent(java.awt.Graphics g) {
        long p0 = System.nanoTime();
        long cpu0 = THREADS.getCurrentThreadCpuTime();
        super.paintComponent(g);
        long p1 = System.nanoTime();
        double paintCpu = (THREADS.getCurrentThreadCpuTime() - cpu0) / 1e6;
        long c = changeNanos;
        if (c != 0 && getChart() != null && appliedNanos > c) {
            changeNanos = 0;
            redraws.add(new Redraw((p1 - c) / 1e6, Math.max(0, startNanos - c) / 1e6,
                    (computedNanos - startNanos) / 1e6, computeCpuMs, (appliedNanos - computedNanos) / 1e6,
                    (p0 - appliedNanos) / 1e6, (p1 - p0) / 1e6, paintCpu));
            afterPaint.run();
        }
        afterEveryPaint.run();
    }

    /** Every timed redraw so far, oldest first (a copy). */
    List<Redraw> redraws() {
        synchronized (redraws) {
            return new ArrayList<>(redraws);
        }
    }

    /** Number of timed redraws so far. */
    int redrawCount() {
        return redraws.size();
    }

    /** The latest timed redraw (call after at least one). */
    Redraw last() {
        synchronized (redraws) {
            return redraws.get(redraws.size() - 1);
        }
    }
}
