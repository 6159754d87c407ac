/**
 * The column generation loop: master and pricing in turn, the bound that proves optimality, stopping
 * criteria, listeners and the run log.
 */
package dev.mixwright.colgen;
