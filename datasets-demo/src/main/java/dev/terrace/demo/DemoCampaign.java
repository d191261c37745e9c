package dev.terrace.demo;

import dev.terrace.core.io.SafeFiles;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The bundled demo campaign. Its scenario and runs are invented for the demo and the tests.
 *
 * @since 0.1
 */
public final class DemoCampaign {

    /** One line describing the demo, with the invented-data label. */
    public static final String SCENARIO =
            "invented data: GaAs droplet-epitaxy dots on GaAs(001) for a made-up photonics test wafer";
    /** File name of the campaign inside the demo folder. */
    public static final String CAMPAIGN_FILE = "campaign.yaml";
    private static final String BASE = "/dev/terrace/demo/ga-dots/";
    private static final List<String> FILES = List.of(CAMPAIGN_FILE, "runs.csv");

    private DemoCampaign() {
    }

    /**
     * @return the demo files by name, as text; never null
     * @throws IOException when a bundled file is missing from the build
     */
    public static Map<String, String> files() throws IOException {
        Map<String, String> m = new LinkedHashMap<>();
        for (String f : FILES) {
            try (InputStream in = DemoCampaign.class.getResourceAsStream(BASE + f)) {
                if (in == null) {
                    throw new IOException("demo file " + f + " missing from the build");
                }
                m.put(f, new String(in.readAllBytes(), StandardCharsets.UTF_8));
            }
        }
        return m;
    }

    /**
     * Copies the demo into a new folder.
     *
     * @param dir the folder; must not exist yet
     * @return the path of the copied campaign file
     * @throws FileAlreadyExistsException when {@code dir} exists
     * @throws IOException                on write failures
     */
    public static Path copyTo(Path dir) throws IOException {
        if (Files.exists(dir)) {
            throw new FileAlreadyExistsException(dir.toString());
        }
        Files.createDirectories(dir);
        for (Map.Entry<String, String> e : files().entrySet()) {
            SafeFiles.writeNew(dir.resolve(e.getKey()), e.getValue());
        }
        return dir.resolve(CAMPAIGN_FILE);
    }
}
