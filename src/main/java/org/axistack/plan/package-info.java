/**
 * The lens plan as a use case: {@link org.axistack.plan.PlanAnalysis} runs every step of the plan on a field
 * solution (solving it first for the {@code plan} command, or re-using the desktop window's) and returns a
 * {@link org.axistack.plan.LensPlan}, everything the plan computed. Between the physics packages and the front
 * ends: it knows nothing of files, the report, the command line or Swing. The report package renders a LensPlan
 * (org.axistack.report.PlanFolder writes the report folder).
 */
package org.axistack.plan;
