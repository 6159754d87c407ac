package dev.mixwright.run;

import dev.mixwright.portfolio.ScenarioStage;
import java.nio.file.Path;
import java.util.Optional;

/**
 * A solve that chooses one range across a scenario set ({@code solve --scenario-set FILE}): the
 * set's file, what the range maximises, and optionally a second set to check the range on.
 */
public record ScenarioSetPlan(Path file, ScenarioStage.Aim aim, Optional<Path> holdOut) {}
