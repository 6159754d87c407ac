package dev.mixwright.run;

import dev.mixwright.portfolio.ScenarioStage;
import java.nio.file.Path;
import java.util.Optional;

/**
 * A solve that chooses one range across a scenario set ({@code solve --scenario-set FILE}): the
 * set's file, what the range maximises, optionally a second set to check the range on, and the
 * engine ({@link dev.mixwright.engine.Engines}) that does the per-scenario work: each scenario's own
 * solve and each hold-out evaluation.
 */
public record ScenarioSetPlan(Path file, ScenarioStage.Aim aim, Optional<Path> holdOut, String engine) {}
