/**
 * Exact ray tracing through an electrostatic lens stack.
 *
 * <p>Design note. A {@link org.axistack.trace.Tracer} integrates the relativistic Lorentz-force
 * equations ({@link org.axistack.trace.LorentzEquations}; state x, y, z, u = gamma beta; independent
 * variable the light path c t) with Hipparchus' adaptive Dormand-Prince 8(5,3). Ends are events of the
 * integrator: observation planes (recorded, first crossing), the screen, the turning point
 * (u_z = 0: reflection) and the region's edge; electrode impacts are found after every step by testing
 * chords of the step's dense output against the electrode outlines ({@link
 * org.axistack.trace.ElectrodeGeometry}, thin sheets and solids alike) and refined by bisection. Every
 * ray reports the energy conservation it achieved (T + q phi at every step against its start).
 *
 * <p>The field is any {@link org.axistack.field.Field}. Three speed layers sit between the tracer and a
 * slow boundary-element field, each with a measured or stated error: {@link
 * org.axistack.trace.AxialTable} (axial derivatives tabulated, Hermite-interpolated), {@link
 * org.axistack.trace.NearAxisField} (the near-axis power series to r^6, first omitted term as the
 * estimate) and {@link org.axistack.trace.FieldMap} (a bicubic Hermite map of the difference between the
 * field and the series; direct field near electrodes). The trace command uses table + series + map;
 * {@code --exact} uses the direct field. (The tests also use a series-or-direct switch, HybridField, kept in
 * the test tree.)
 *
 * <p>Ray sets ({@link org.axistack.trace.RaySets}, {@link org.axistack.trace.RaySet}) are traced in
 * parallel by {@link org.axistack.trace.BundleTracer} with progress and cancellation ({@link
 * org.axistack.trace.TraceProgress}); {@link org.axistack.trace.BundleResult} gives plane statistics
 * and table rows. {@link org.axistack.trace.TracedAberrations} measures F2, f2, Cs and Cc by fitting
 * traces (independent of the aberration integrals of org.axistack.optics, which the tests compare);
 * {@link org.axistack.trace.SpotBudget} turns them into a spot-size budget. SI units throughout;
 * nothing here knows about files, the command line or Swing.
 */
package org.axistack.trace;
