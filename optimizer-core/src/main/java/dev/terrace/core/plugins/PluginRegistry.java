package dev.terrace.core.plugins;

import dev.terrace.spi.GrowthModel;

import java.io.IOException;
import java.net.MalformedURLException;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.CodeSource;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.ServiceConfigurationError;
import java.util.ServiceLoader;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * Finds growth-model plugins with {@link ServiceLoader}, on the classpath and in the jars of
 * plugin folders, and checks their ids. The only place in Terrace that loads plugins.
 *
 * <p>A blank id, an id that is not lower-case-hyphenated, or an id claimed by two plugins is a
 * fatal {@link PluginProblem} naming both sources; those plugins are withheld. A plugin whose
 * constructor or {@code id()} throws is reported and skipped; the others still load.
 *
 * @since 0.1
 */
public final class PluginRegistry {

    /** Environment variable naming a plugin folder. */
    public static final String PLUGIN_DIR_ENV = "TERRACE_PLUGINS";
    private static final Pattern ID = Pattern.compile("[a-z0-9]+(-[a-z0-9]+)*");

    private final Map<String, LoadedModel> models;
    private final List<PluginProblem> problems;

    private PluginRegistry(Map<String, LoadedModel> models, List<PluginProblem> problems) {
        this.models = models;
        this.problems = List.copyOf(problems);
    }

    /** @return a builder; by default it discovers plugins on the classpath */
    public static Builder builder() {
        return new Builder();
    }

    /** @return usable models in discovery order; never null */
    public List<LoadedModel> models() {
        return List.copyOf(models.values());
    }

    /** @return ids of the usable models, sorted; never null */
    public Set<String> ids() {
        return new TreeSet<>(models.keySet());
    }

    /**
     * @param id a model id
     * @return the model, if discovered and usable
     */
    public Optional<GrowthModel> model(String id) {
        return Optional.ofNullable(models.get(id)).map(LoadedModel::model);
    }

    /** @return every problem found during discovery; never null */
    public List<PluginProblem> problems() {
        return problems;
    }

    /** @return true when some plugin ids were ambiguous or blank */
    public boolean hasFatalProblems() {
        return problems.stream().anyMatch(PluginProblem::fatal);
    }

    /** Settings for discovery; not thread-safe. */
    public static final class Builder {
        private boolean autoDiscovery = true;
        private final List<Path> dirs = new ArrayList<>();
        private final List<GrowthModel> added = new ArrayList<>();
        private ClassLoader parent = PluginRegistry.class.getClassLoader();

        private Builder() {
        }

        /**
         * @param on whether to discover plugins on the classpath. Default value is true.
         * @return this builder
         */
        public Builder autoDiscovery(boolean on) {
            this.autoDiscovery = on;
            return this;
        }

        /**
         * @param dir a folder whose {@code *.jar} files hold plugins; ignored when null
         * @return this builder
         */
        public Builder pluginDir(Path dir) {
            if (dir != null) {
                dirs.add(dir);
            }
            return this;
        }

        /**
         * @param model a plugin instance to register directly (tests, demos)
         * @return this builder
         */
        public Builder add(GrowthModel model) {
            added.add(model);
            return this;
        }

        /** @return the registry; never null */
        public PluginRegistry build() {
            List<PluginProblem> problems = new ArrayList<>();
            List<LoadedModel> found = new ArrayList<>();
            for (GrowthModel m : added) {
                accept(m, "added directly", found, problems);
            }
            if (autoDiscovery) {
                load(ServiceLoader.load(GrowthModel.class, parent), null, found, problems);
            }
            for (Path dir : dirs) {
                if (!Files.isDirectory(dir)) {
                    problems.add(new PluginProblem(false, dir.toString(), "plugin folder " + dir + " does not exist"));
                    continue;
                }
                List<Path> jars;
                try (Stream<Path> s = Files.list(dir)) {
                    jars = s.filter(p -> p.getFileName().toString().endsWith(".jar")).sorted().toList();
                } catch (IOException e) {
                    problems.add(new PluginProblem(false, dir.toString(), "cannot list plugin folder " + dir + ": "
                            + e.getMessage()));
                    continue;
                }
                for (Path jar : jars) {
                    Optional<String> unreadable = unreadableJar(jar);
                    if (unreadable.isPresent()) {
                        problems.add(new PluginProblem(false, jar.toString(), unreadable.get()));
                        continue;
                    }
                    URLClassLoader loader;
                    try {
                        loader = new URLClassLoader(new URL[] {jar.toUri().toURL()}, parent);
                    } catch (MalformedURLException e) {
                        problems.add(new PluginProblem(false, jar.toString(), "cannot open " + jar));
                        continue;
                    }
                    load(ServiceLoader.load(GrowthModel.class, loader), loader, found, problems);
                }
            }
            Map<String, LoadedModel> byId = new LinkedHashMap<>();
            Map<String, List<LoadedModel>> claims = new LinkedHashMap<>();
            for (LoadedModel lm : found) {
                claims.computeIfAbsent(lm.id(), k -> new ArrayList<>()).add(lm);
            }
            for (Map.Entry<String, List<LoadedModel>> e : claims.entrySet()) {
                List<LoadedModel> c = e.getValue();
                if (c.size() == 1) {
                    byId.put(e.getKey(), c.get(0));
                    continue;
                }
                StringBuilder sb = new StringBuilder("growth-model id '" + e.getKey() + "' is claimed by "
                        + c.size() + " plugins: ");
                for (int i = 0; i < c.size(); i++) {
                    sb.append(i == 0 ? "" : " and ").append(c.get(i).className()).append(" in ").append(c.get(i).source());
                }
                sb.append("; remove one of them (neither is used)");
                problems.add(new PluginProblem(true, c.get(0).source(), sb.toString()));
            }
            return new PluginRegistry(byId, problems);
        }

        /**
         * Why a plugin jar cannot be used, or empty when it is a readable jar that declares a
         * growth-model service. A class loader skips a corrupt jar without a word, so it is opened
         * here first.
         */
        static Optional<String> unreadableJar(Path jar) {
            String entry = "META-INF/services/" + GrowthModel.class.getName();
            try (java.util.jar.JarFile jf = new java.util.jar.JarFile(jar.toFile())) {
                if (jf.getEntry(entry) == null) {
                    return Optional.of("plugin jar " + jar + " declares no growth model (it has no " + entry
                            + " entry); it is not used");
                }
                return Optional.empty();
            } catch (IOException | SecurityException e) {
                return Optional.of("plugin jar " + jar + " cannot be read as a jar (" + rootMessage(e)
                        + "); replace it with a complete copy or remove it from the folder");
            }
        }

        private static void load(ServiceLoader<GrowthModel> sl, ClassLoader only, List<LoadedModel> found,
                                 List<PluginProblem> problems) {
            Iterator<ServiceLoader.Provider<GrowthModel>> it = sl.stream().iterator();
            while (true) {
                ServiceLoader.Provider<GrowthModel> p;
                try {
                    if (!it.hasNext()) {
                        break;
                    }
                    p = it.next();
                } catch (ServiceConfigurationError e) {
                    problems.add(new PluginProblem(false, "service configuration",
                            "a growth-model plugin could not be loaded and was skipped: " + rootMessage(e)));
                    continue;
                }
                Class<? extends GrowthModel> type;
                try {
                    type = p.type();
                } catch (ServiceConfigurationError e) {
                    problems.add(new PluginProblem(false, "service configuration",
                            "a growth-model plugin could not be loaded and was skipped: " + rootMessage(e)));
                    continue;
                }
                if (only != null && type.getClassLoader() != only) {
                    continue; // found through the parent loader; already seen on the classpath
                }
                String source = sourceOf(type);
                GrowthModel m;
                try {
                    m = p.get();
                } catch (ServiceConfigurationError | RuntimeException | LinkageError e) {
                    problems.add(new PluginProblem(false, source, "plugin " + type.getName() + " in " + source
                            + " failed to start and was skipped: " + rootMessage(e)));
                    continue;
                }
                accept(m, source, found, problems);
            }
        }

        private static void accept(GrowthModel m, String source, List<LoadedModel> found, List<PluginProblem> problems) {
            String cls = m.getClass().getName();
            String id;
            try {
                id = m.id();
            } catch (RuntimeException | LinkageError e) {
                problems.add(new PluginProblem(false, source, "plugin " + cls + " in " + source
                        + " failed when asked for its id and was skipped: " + rootMessage(e)));
                return;
            }
            if (id == null || id.isBlank()) {
                problems.add(new PluginProblem(true, source, "plugin " + cls + " in " + source
                        + " has a blank id; it is not used"));
                return;
            }
            if (!ID.matcher(id).matches()) {
                problems.add(new PluginProblem(true, source, "plugin " + cls + " in " + source + " has id '" + id
                        + "', which is not lower case letters, digits and '-'; it is not used"));
                return;
            }
            found.add(new LoadedModel(m, id, cls, source));
        }

        private static String sourceOf(Class<?> type) {
            try {
                CodeSource cs = type.getProtectionDomain().getCodeSource();
                if (cs != null && cs.getLocation() != null) {
                    return Path.of(cs.getLocation().toURI()).toString();
                }
            } catch (Exception e) {
                // fall through
            }
            return "classpath";
        }

        private static String rootMessage(Throwable e) {
            Throwable t = e;
            while (t.getCause() != null && t.getCause() != t) {
                t = t.getCause();
            }
            String msg = t.getMessage();
            return t.getClass().getSimpleName() + (msg == null ? "" : ": " + msg);
        }
    }
}
