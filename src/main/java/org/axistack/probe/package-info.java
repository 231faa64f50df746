/**
 * Focused-probe planning: the probe diameter (FW50) against beam current and aperture angle from the source
 * (reduced brightness, virtual source size), diffraction, and the spherical and chromatic aberrations of the
 * lens, combined by the root-power-sum of Barth and Kruit, with simple quadrature for comparison; the optimum
 * aperture angle at each current and the dominant contribution. Design note and verification table:
 * src/site/markdown/probe.md. SI inside; no files, plotting or command line here.
 */
package org.axistack.probe;
