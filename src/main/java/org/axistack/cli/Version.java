package org.axistack.cli;

import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;
import picocli.CommandLine;

/** Version text for --version: the project version the build wrote into {@code org/axistack/version.properties}. */
final class Version implements CommandLine.IVersionProvider {

    /** The build's version ("0.1.0-SNAPSHOT"), or "unknown" when the resource is missing or unfiltered. */
    static String number() {
        try (InputStream in = Version.class.getResourceAsStream("/org/axistack/version.properties")) {
            if (in == null) {
                return "unknown";
            }
            Properties p = new Properties();
            p.load(in);
            String v = p.getProperty("version", "").trim();
            return v.isEmpty() || v.startsWith("${") ? "unknown" : v;
        } catch (IOException e) {
            return "unknown";
        }
    }

    @Override
    public String[] getVersion() {
        return new String[] {"axistack " + number(),
            "Java " + System.getProperty("java.version") + " (" + System.getProperty("java.vendor") + ")"};
    }
}
