package org.spindrift.sim.scenario;

import java.nio.file.Path;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.scenario.Scenario;

/**
 * A scenario read from a file, with the line of every key kept for later checks that need the
 * physics (orbit radius against the ISCO, horizon, ...), so those messages also name file, line
 * and key path.
 */
public final class LoadedScenario {
    private final Path file;
    private final Scenario scenario;
    private final ConfigSection.LineIndex lines;

    LoadedScenario(Path file, Scenario scenario, ConfigSection.LineIndex lines) {
        this.file = file;
        this.scenario = scenario;
        this.lines = lines;
    }

    /** Wraps a scenario built in code (tests, benchmarks); errors then name the given label. */
    public static LoadedScenario of(Scenario scenario, String label) {
        return new LoadedScenario(Path.of(label), scenario, new ConfigSection.LineIndex());
    }

    /** @return the file it came from */
    public Path file() {
        return file;
    }

    /** @return the checked scenario */
    public Scenario scenario() {
        return scenario;
    }

    /** @return a copy holding another scenario (for example with a particle count changed), same lines */
    public LoadedScenario with(Scenario s) {
        return new LoadedScenario(file, s, lines);
    }

    /** @return the line of a key path such as {@code sources[0].orbit.circular.radius_M}, or -1 */
    public int line(String keyPath) {
        return lines.line(keyPath);
    }

    /** @return a user-input error naming file, line and key path */
    public UserInputException error(String keyPath, String problem) {
        return ConfigSection.error(file, line(keyPath), keyPath, problem);
    }
}
