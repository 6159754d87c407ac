/**
 * Pricing: given dual values, find the columns of largest reduced cost over the whole variant space.
 * One {@link dev.mixwright.pricing.Pricer} interface, several algorithms.
 */
package dev.mixwright.pricing;
