/**
 * A run of the application, shared by solve, resume and sweep: the catalog read once, the LP stage
 * and then the integer stage, the run folder written, and a typed outcome for the command line.
 */
package dev.mixwright.run;
