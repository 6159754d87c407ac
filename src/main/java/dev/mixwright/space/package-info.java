/**
 * The variant space compiled for speed: a variant is an {@code int[]} of choice indices, rules are
 * compiled into forbidden combinations, and the buildable space is counted without listing it.
 */
package dev.mixwright.space;
