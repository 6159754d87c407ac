package dev.mixwright.portfolio;

/** A variant with its value ψ at the prices of a {@link VariantQuery} (see {@link VariantPricer}). */
public record ValuedVariant(int[] choices, double value) {}
