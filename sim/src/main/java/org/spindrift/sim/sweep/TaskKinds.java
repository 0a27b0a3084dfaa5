package org.spindrift.sim.sweep;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.ServiceLoader;

/**
 * The task kinds a sweep file may name. {@code scenario} is built in; other modules add kinds
 * through {@link ServiceLoader} ({@code META-INF/services/org.spindrift.sim.sweep.TaskKind}).
 */
public final class TaskKinds {
    private TaskKinds() {
    }

    /** @return every known kind by name, {@code scenario} first */
    public static Map<String, TaskKind> all() {
        Map<String, TaskKind> kinds = new LinkedHashMap<>();
        TaskKind scenario = new ScenarioTaskKind();
        kinds.put(scenario.name(), scenario);
        for (TaskKind k : ServiceLoader.load(TaskKind.class)) {
            kinds.putIfAbsent(k.name(), k);
        }
        return kinds;
    }

    /** @return the kind of that name, or null */
    public static TaskKind get(String name) {
        return all().get(name);
    }
}
