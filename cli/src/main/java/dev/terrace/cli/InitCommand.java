package dev.terrace.cli;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.io.SafeFiles;
import dev.terrace.core.runlog.RunLogWriter;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

/** {@code terrace init DIR}: writes a commented campaign file and an empty run log. */
@Command(name = "init", mixinStandardHelpOptions = true,
        description = {"Start a new campaign: writes DIR/campaign.yaml (a commented template for the kind of series"
                + " given by --kind) and an empty DIR/runs.csv.",
                "The campaign id comes from the folder name. Refuses to overwrite existing files."})
final class InitCommand implements Callable<Integer> {

    /** Name of the campaign file written by init. */
    static final String CAMPAIGN_FILE = "campaign.yaml";

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Parameters(index = "0", paramLabel = "DIR", description = "Folder for the new campaign (created if needed).")
    Path dir;

    /** The kinds of series init has a template for, each in its own resource file (templates/KIND.yaml). */
    static final java.util.List<String> KINDS = java.util.List.of("droplet-dots", "sk-dots", "film");

    /** The kind written without --kind. */
    static final String DEFAULT_KIND = "droplet-dots";

    /** Placeholder for the campaign id in the templates. */
    static final String ID_PLACEHOLDER = "{{ID}}";

    /** Id used when the folder name holds no letter or digit. */
    static final String FALLBACK_ID = "new-campaign";

    @picocli.CommandLine.Option(names = "--kind", paramLabel = "KIND", defaultValue = DEFAULT_KIND,
            description = "The kind of series: droplet-dots (droplet epitaxy), sk-dots (Stranski-Krastanov dots) or"
                    + " film (step-flow film growth) (default: ${DEFAULT-VALUE}).")
    String kind;

    @Override
    public Integer call() throws Exception {
        PrintWriter out = spec.commandLine().getOut();
        if (!KINDS.contains(kind)) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--kind must be one of "
                    + String.join(", ", KINDS) + ", found '" + kind + "'");
        }
        String template = template(kind).replace(ID_PLACEHOLDER, idFor(dir));
        Path campaignFile = dir.resolve(CAMPAIGN_FILE);
        Campaign c = CampaignReader.parse(campaignFile, new StringReader(template), null).campaign();
        Path runs = c.runs();
        for (Path p : new Path[] {campaignFile, runs}) {
            if (Files.exists(p)) {
                throw new CommandLine.ParameterException(spec.commandLine(),
                        p + " exists already; init never overwrites files (choose another folder)");
            }
        }
        SafeFiles.writeNew(campaignFile, template);
        SafeFiles.writeNew(runs, RunLogWriter.emptyLog(c));
        out.println("wrote " + campaignFile);
        out.println("wrote " + runs);
        out.println("wrote a " + kind + " template; the materials it may name are listed by: terrace models");
        out.println(NextStep.PREFIX + "edit the campaign to match your chamber, record runs in " + runs.getFileName()
                + " (terrace record), then run: terrace check " + campaignFile);
        out.flush();
        return 0;
    }

    /**
     * @param kind one of {@link #KINDS}
     * @return the template's text, with {@value #ID_PLACEHOLDER} where the campaign id goes
     * @throws IOException when the template is missing from the build
     */
    static String template(String kind) throws IOException {
        try (InputStream in = InitCommand.class.getResourceAsStream("templates/" + kind + ".yaml")) {
            if (in == null) {
                throw new IOException("campaign template '" + kind + "' missing from the build");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }

    /**
     * A campaign id from a folder name: lower case, every run of other characters as one '-', no
     * leading or trailing '-' ("InAs QDs 2026" gives "inas-qds-2026").
     *
     * @param dir the folder
     * @return the id; {@value #FALLBACK_ID} when the name holds no letter or digit
     */
    static String idFor(Path dir) {
        Path name = dir.toAbsolutePath().normalize().getFileName();
        String id = name == null ? "" : java.text.Normalizer.normalize(name.toString(), java.text.Normalizer.Form.NFKD)
                .toLowerCase(java.util.Locale.ROOT).replaceAll("[^a-z0-9]+", "-").replaceAll("(^-+|-+$)", "");
        return id.isEmpty() ? FALLBACK_ID : id;
    }
}
