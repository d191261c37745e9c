package dev.terrace.models;

import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Plugins may use only {@code dev.terrace.spi} from Terrace (and the JDK, plus Commons Math if needed):
 * the contract of {@link dev.terrace.spi.GrowthModel}. Scans the module's main sources.
 */
class SpiOnlyDependencyTest {

    private static final Pattern TERRACE_REFERENCE = Pattern.compile("\\bdev\\.terrace\\.([a-z]+)");
    private static final Pattern IMPORT = Pattern.compile("^import\\s+(static\\s+)?([\\w.]+)", Pattern.MULTILINE);

    @Test
    void mainSourcesReferenceOnlyTheSpiPackageOfTerrace() throws IOException {
        Path root = Path.of("src", "main", "java");
        assertTrue(Files.isDirectory(root), "run from the model-plugins module directory: " + root.toAbsolutePath());
        List<Path> sources;
        try (Stream<Path> s = Files.walk(root)) {
            sources = s.filter(p -> p.toString().endsWith(".java")).toList();
        }
        assertFalse(sources.isEmpty(), "no sources found under " + root.toAbsolutePath());
        List<String> offences = new ArrayList<>();
        for (Path p : sources) {
            String text = Files.readString(p, StandardCharsets.UTF_8);
            Matcher m = TERRACE_REFERENCE.matcher(text);
            while (m.find()) {
                String pkg = m.group(1);
                if (!pkg.equals("spi") && !pkg.equals("models")) {
                    offences.add(p + ": dev.terrace." + pkg);
                }
            }
            Matcher imp = IMPORT.matcher(text);
            while (imp.find()) {
                String name = imp.group(2);
                boolean allowed = name.startsWith("java.") || name.startsWith("dev.terrace.spi.")
                        || name.startsWith("dev.terrace.models.") || name.startsWith("org.apache.commons.math3.");
                if (!allowed) {
                    offences.add(p + ": import " + name);
                }
            }
        }
        assertTrue(offences.isEmpty(), "plugins reach outside the SPI: " + offences);
    }
}
