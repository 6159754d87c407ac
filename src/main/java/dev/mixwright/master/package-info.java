/**
 * The restricted master LP; the only package that talks to the LP solver (OR-Tools GLOP).
 */
package dev.mixwright.master;
