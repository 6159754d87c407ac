/**
 * Explanations of single decisions: the reduced-cost breakdown of a variant in a segment and the
 * price change at which it would enter or leave the plan.
 */
package dev.mixwright.explain;
