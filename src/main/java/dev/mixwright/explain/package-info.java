/**
 * Explanations of single decisions: the reduced-cost breakdown of a variant in a segment, the
 * price change at which it would enter or leave the plan, and the capacity range over which a
 * resource's shadow price holds, found by re-solving the whole problem.
 */
package dev.mixwright.explain;
