/**
 * The lens plan as a use case: {@link org.axistack.plan.PlanAnalysis} runs every step of the plan on a field
 * solution (solving it first for the {@code plan} command, or re-using the desktop window's), and
 * {@link org.axistack.plan.PlanFolder} writes the report folder. Between the physics packages and the two front
 * ends: it knows the report's values and files but nothing of the command line or Swing.
 */
package org.axistack.plan;
