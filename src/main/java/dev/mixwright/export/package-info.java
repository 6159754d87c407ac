/**
 * A finished run in forms a planner keeps: short variant codes, the matrix view (variants by option
 * groups), and exports as CSV tables, an xlsx workbook and MPS models of the run's LP and MIP.
 */
package dev.mixwright.export;
