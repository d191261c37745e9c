package dev.terrace.cli;

import dev.terrace.core.plugins.PluginRegistry;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;

/** Builds the plugin registry from the global options and reports discovery problems. */
final class Registries {
    private Registries() {
    }

    static PluginRegistry load(GlobalOptions g, PrintWriter err) {
        Path dir = g.pluginDir;
        if (dir != null && !Files.isDirectory(dir)) {
            throw new UsageException("--plugins " + dir + (Files.exists(dir) ? " is not a folder" : " does not exist")
                    + "; expected a folder of growth-model plugin jars");
        }
        if (dir == null) {
            String env = System.getenv(PluginRegistry.PLUGIN_DIR_ENV);
            if (env != null && !env.isBlank()) {
                dir = Path.of(env);
            }
        }
        PluginRegistry r = PluginRegistry.builder().pluginDir(dir).build();
        DiagnosticLines.print(err, r.problems().stream().map(p -> "terrace: " + p).toList());
        err.flush();
        return r;
    }
}
