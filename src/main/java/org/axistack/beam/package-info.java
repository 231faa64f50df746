/**
 * Beam envelope with emittance and space charge: the round-beam (KV) envelope equation through a solved
 * lens, generalised perveance, emittance conventions (edge = 4 x rms; normalised emittance conserved),
 * bore fill and warnings, and waist-against-current scans. Design note and verification table:
 * src/site/markdown/envelope.md. SI inside; no files, plotting or command line here.
 */
package org.axistack.beam;
