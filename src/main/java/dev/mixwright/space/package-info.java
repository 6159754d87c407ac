/**
 * The variant space compiled for speed: a variant is an {@code int[]} of choice indices, rules are
 * compiled into forbidden combinations, the buildable space is counted without listing it, and the
 * rules that leave it (or a segment) empty are named. Also what every search over the space shares:
 * its group order, rule propagation (forward checking) and the min-fill elimination order.
 */
package dev.mixwright.space;
