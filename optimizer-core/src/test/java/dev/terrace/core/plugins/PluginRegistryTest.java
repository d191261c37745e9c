package dev.terrace.core.plugins;

import dev.terrace.core.TestGrowthModel;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import javax.tools.JavaCompiler;
import javax.tools.ToolProvider;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class PluginRegistryTest {

    /** A minimal valid plugin for registry tests. */
    static class FakeModel extends TestGrowthModel {
        FakeModel(String id) {
            super(id, "fake model for registry tests", Role.SUBSTRATE_TEMPERATURE, Role.ISLAND_DENSITY);
        }

        @Override
        public Prediction predict(Conditions c, Surface s, ParameterValues p) {
            return new Prediction(Map.of(Role.ISLAND_DENSITY, 1e10), Map.of(), dev.terrace.spi.Validity.ok(), List.of());
        }
    }

    static final class IdThrows extends FakeModel {
        IdThrows() {
            super("unused");
        }

        @Override
        public String id() {
            throw new IllegalStateException("broken id");
        }
    }

    @Test
    void registersDirectlyAddedModelsWithoutDiscovery() {
        PluginRegistry r = PluginRegistry.builder().autoDiscovery(false).add(new FakeModel("alpha")).build();
        assertEquals(Set.of("alpha"), r.ids());
        assertTrue(r.problems().isEmpty());
        assertTrue(r.model("alpha").isPresent());
    }

    @Test
    void rejectsDuplicateIdsNamingBothSources() {
        PluginRegistry r = PluginRegistry.builder().autoDiscovery(false)
                .add(new FakeModel("same")).add(new FakeModel("same")).add(new FakeModel("other")).build();
        assertEquals(Set.of("other"), r.ids(), "neither duplicate is used");
        assertTrue(r.hasFatalProblems());
        String msg = r.problems().get(0).message();
        assertTrue(msg.contains("'same'") && msg.contains("claimed by 2 plugins"), msg);
    }

    @Test
    void rejectsBlankAndMalformedIds() {
        PluginRegistry r = PluginRegistry.builder().autoDiscovery(false)
                .add(new FakeModel(" ")).add(new FakeModel("Bad_Id")).build();
        assertTrue(r.ids().isEmpty());
        assertEquals(2, r.problems().size());
        assertTrue(r.problems().stream().allMatch(PluginProblem::fatal));
    }

    @Test
    void skipsAPluginWhoseIdThrowsAndKeepsTheOthers() {
        PluginRegistry r = PluginRegistry.builder().autoDiscovery(false)
                .add(new IdThrows()).add(new FakeModel("fine")).build();
        assertEquals(Set.of("fine"), r.ids());
        assertFalse(r.hasFatalProblems());
        assertTrue(r.problems().get(0).message().contains("broken id"));
    }

    @Test
    void loadsPluginJarsFromAFolderAndIsolatesAThrowingOne(@TempDir Path tmp) throws Exception {
        Path dir = Files.createDirectory(tmp.resolve("plugins"));
        buildPluginJar(tmp, dir.resolve("good.jar"), "ext.GoodModel", "folder-model", false);
        buildPluginJar(tmp, dir.resolve("bad.jar"), "ext.BadModel", "bad-model", true);
        PluginRegistry r = PluginRegistry.builder().autoDiscovery(false).pluginDir(dir).build();
        assertEquals(Set.of("folder-model"), r.ids());
        LoadedModel lm = r.models().get(0);
        assertTrue(lm.source().endsWith("good.jar"), lm.source());
        assertEquals(1, r.problems().size(), r.problems().toString());
        PluginProblem p = r.problems().get(0);
        assertFalse(p.fatal());
        assertTrue(p.message().contains("ext.BadModel") && p.message().contains("bad.jar"), p.message());
    }

    @Test
    void duplicateIdAcrossJarsNamesBothJars(@TempDir Path tmp) throws Exception {
        Path dir = Files.createDirectory(tmp.resolve("plugins"));
        buildPluginJar(tmp, dir.resolve("one.jar"), "ext.One", "twin", false);
        buildPluginJar(tmp, dir.resolve("two.jar"), "ext.Two", "twin", false);
        PluginRegistry r = PluginRegistry.builder().autoDiscovery(false).pluginDir(dir).build();
        assertTrue(r.ids().isEmpty());
        String msg = r.problems().get(0).message();
        assertTrue(msg.contains("one.jar") && msg.contains("two.jar"), msg);
    }

    @Test
    void reportsAMissingPluginFolderWithoutFailing(@TempDir Path tmp) {
        PluginRegistry r = PluginRegistry.builder().autoDiscovery(false).pluginDir(tmp.resolve("nope")).build();
        assertFalse(r.hasFatalProblems());
        assertTrue(r.problems().get(0).message().contains("does not exist"));
    }

    /** Compiles a one-class plugin and packs it with its service file into a jar. */
    @Test
    void reportsACorruptPluginJarAndAJarWithoutAServiceEntry(@TempDir Path tmp) throws Exception {
        Path dir = Files.createDirectories(tmp.resolve("plugins"));
        // a download cut short: the zip local-file signature "PK\3\4" (PKWARE APPNOTE.TXT 4.3.7) and then nothing
        Files.write(dir.resolve("broken.jar"), new byte[] {'P', 'K', 3, 4, 0, 0});
        try (java.util.jar.JarOutputStream out = new java.util.jar.JarOutputStream(
                Files.newOutputStream(dir.resolve("empty.jar")))) {
            out.putNextEntry(new java.util.jar.JarEntry("readme.txt"));
            out.write("no plugin here".getBytes(java.nio.charset.StandardCharsets.UTF_8));
            out.closeEntry();
        }
        PluginRegistry r = PluginRegistry.builder().autoDiscovery(false).pluginDir(dir).build();
        assertTrue(r.ids().isEmpty());
        List<String> messages = r.problems().stream().map(PluginProblem::message).toList();
        assertEquals(2, messages.size(), messages::toString);
        assertTrue(messages.stream().anyMatch(m -> m.contains("broken.jar cannot be read as a jar")), messages::toString);
        assertTrue(messages.stream().anyMatch(m -> m.contains("empty.jar declares no growth model")), messages::toString);
    }

    static void buildPluginJar(Path work, Path jar, String className, String id, boolean throwInConstructor)
            throws IOException {
        String pkg = className.substring(0, className.lastIndexOf('.'));
        String simple = className.substring(className.lastIndexOf('.') + 1);
        String src = "package " + pkg + ";\n"
                + "import dev.terrace.spi.*; import java.util.*;\n"
                + "public class " + simple + " implements GrowthModel {\n"
                + "  public " + simple + "() { " + (throwInConstructor ? "throw new IllegalStateException(\"boom\");" : "") + " }\n"
                + "  public String id() { return \"" + id + "\"; }\n"
                + "  public String description() { return \"test plugin\"; }\n"
                + "  public Set<Role> requiredInputs() { return Set.of(Role.SUBSTRATE_TEMPERATURE); }\n"
                + "  public Set<Role> predictedOutcomes() { return Set.of(Role.ISLAND_DENSITY); }\n"
                + "  public List<ModelParameter> parameters() { return List.of(); }\n"
                + "  public Prediction predict(Conditions c, Surface s, ParameterValues p) {\n"
                + "    return new Prediction(Map.of(Role.ISLAND_DENSITY, 1e10), Map.of(), Validity.ok(), List.of()); }\n"
                + "}\n";
        Path srcDir = Files.createDirectories(work.resolve("src-" + simple).resolve(pkg.replace('.', '/')));
        Path file = srcDir.resolve(simple + ".java");
        Files.writeString(file, src);
        Path out = Files.createDirectories(work.resolve("classes-" + simple));
        JavaCompiler jc = ToolProvider.getSystemJavaCompiler();
        ByteArrayOutputStream diag = new ByteArrayOutputStream();
        int rc = jc.run(null, null, diag, "-classpath", System.getProperty("java.class.path"), "-d", out.toString(),
                file.toString());
        assertEquals(0, rc, diag.toString(StandardCharsets.UTF_8));
        try (OutputStream os = Files.newOutputStream(jar); JarOutputStream jos = new JarOutputStream(os)) {
            jos.putNextEntry(new JarEntry("META-INF/services/dev.terrace.spi.GrowthModel"));
            jos.write((className + "\n").getBytes(StandardCharsets.UTF_8));
            jos.closeEntry();
            try (Stream<Path> s = Files.walk(out)) {
                for (Path p : s.filter(Files::isRegularFile).toList()) {
                    jos.putNextEntry(new JarEntry(out.relativize(p).toString().replace('\\', '/')));
                    jos.write(Files.readAllBytes(p));
                    jos.closeEntry();
                }
            }
        }
    }
}
