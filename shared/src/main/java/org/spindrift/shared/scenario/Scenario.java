package org.spindrift.shared.scenario;

import java.util.List;
import java.util.Objects;

/**
 * A parsed, checked scenario file. Immutable; built by the scenario loader in {@code sim}
 * ({@code org.spindrift.sim.scenario.ScenarioLoader}), which also checks every range.
 *
 * @param name scenario name (default: file name without extension); names the default run folder
 * @param description free text (demo configs say there that they are invented)
 * @param blackHole the central object
 * @param observer inclination and position angle
 * @param sources at least one source; the first one's centre defines "orbits" as a duration unit
 * @param run duration, cadence, seed, tolerance, archive subsample
 * @param imaging camera settings (defaults when absent)
 * @param instrument instrument effects (defaults when absent)
 * @param interferometer interferometric array observing the flare (null: none)
 */
public record Scenario(String name, String description, BlackHole blackHole, Observer observer,
        List<Source> sources, RunSettings run, Imaging imaging, Instrument instrument, Interferometer interferometer) {
    public Scenario {
        Objects.requireNonNull(name, "name");
        description = description == null ? "" : description;
        Objects.requireNonNull(blackHole, "blackHole");
        Objects.requireNonNull(observer, "observer");
        sources = List.copyOf(sources);
        Objects.requireNonNull(run, "run");
        imaging = imaging == null ? Imaging.defaults() : imaging;
        instrument = instrument == null ? Instrument.defaults() : instrument;
    }

    /** A scenario without an interferometer. */
    public Scenario(String name, String description, BlackHole blackHole, Observer observer,
            List<Source> sources, RunSettings run, Imaging imaging, Instrument instrument) {
        this(name, description, blackHole, observer, sources, run, imaging, instrument, null);
    }

    /** @return total number of simulated particles */
    public int totalParticles() {
        int n = 0;
        for (Source s : sources) {
            n += s.particles();
        }
        return n;
    }

    /** @return a copy with other sources */
    public Scenario withSources(List<Source> s) {
        return new Scenario(name, description, blackHole, observer, s, run, imaging, instrument, interferometer);
    }

    /** @return a copy with other run settings */
    public Scenario withRun(RunSettings r) {
        return new Scenario(name, description, blackHole, observer, sources, r, imaging, instrument, interferometer);
    }

    /** @return a copy with other imaging settings */
    public Scenario withImaging(Imaging i) {
        return new Scenario(name, description, blackHole, observer, sources, run, i, instrument, interferometer);
    }

    /** @return a copy with another black hole */
    public Scenario withBlackHole(BlackHole b) {
        return new Scenario(name, description, b, observer, sources, run, imaging, instrument, interferometer);
    }
}
