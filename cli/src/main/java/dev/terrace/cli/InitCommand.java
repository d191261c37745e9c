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
        description = {"Start a new campaign: writes DIR/campaign.yaml (commented) and an empty DIR/runs.csv.",
                "Refuses to overwrite existing files."})
final class InitCommand implements Callable<Integer> {

    /** Name of the campaign file written by init. */
    static final String CAMPAIGN_FILE = "campaign.yaml";

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Parameters(index = "0", paramLabel = "DIR", description = "Folder for the new campaign (created if needed).")
    Path dir;

    @Override
    public Integer call() throws Exception {
        PrintWriter out = spec.commandLine().getOut();
        String template = template();
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
        out.println("next: edit the campaign to match your chamber, record runs in " + runs.getFileName()
                + ", then run: terrace check " + campaignFile);
        out.flush();
        return 0;
    }

    static String template() throws IOException {
        try (InputStream in = Campaign.class.getResourceAsStream("/dev/terrace/core/campaign-template.yaml")) {
            if (in == null) {
                throw new IOException("campaign template missing from the build");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }
}
