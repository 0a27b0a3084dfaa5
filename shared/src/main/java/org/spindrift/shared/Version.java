package org.spindrift.shared;

import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;

/** The code version, filled in by the build from the Maven project version. */
public final class Version {
    private Version() {
    }

    /** @return the project version, or "unknown" when run from unpackaged classes */
    public static String get() {
        try (InputStream in = Version.class.getResourceAsStream("version.properties")) {
            if (in == null) {
                return "unknown";
            }
            Properties p = new Properties();
            p.load(in);
            return p.getProperty("version", "unknown");
        } catch (IOException e) {
            return "unknown";
        }
    }
}
