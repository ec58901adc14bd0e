package dev.annotator.cli;

import picocli.CommandLine;

import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;

/** The version stamped into the jar at build time. */
public final class VersionProvider implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
        return new String[]{"annotator " + version()};
    }

    public static String version() {
        try (InputStream in = VersionProvider.class.getResourceAsStream("/dev/annotator/version.properties")) {
            Properties p = new Properties();
            if (in != null) {
                p.load(in);
            }
            return p.getProperty("version", "unknown");
        } catch (IOException e) {
            return "unknown";
        }
    }
}
