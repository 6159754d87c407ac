/**
 * Demand that chooses: multinomial-logit utilities, attractions and shares on primitive arrays,
 * and the description of a catalog's choice data that {@code check} prints.
 */
package dev.mixwright.choice;
