package dev.terrace.core.runlog;

import java.nio.file.Path;
import java.util.Map;

/** Run in a child JVM by {@link RunLogAppenderTest}: records runs into a run log as fast as it can. */
public final class RunLogAppendChild {

    private RunLogAppendChild() {
    }

    /**
     * @param args the run log, a tag, how many runs
     * @throws Exception on failure (the child exits non-zero)
     */
    public static void main(String[] args) throws Exception {
        Path runs = Path.of(args[0]);
        int n = Integer.parseInt(args[2]);
        for (int k = 0; k < n; k++) {
            RunLogAppender.append(RunLogAppenderTest.campaignAt(runs), Map.of("notes", args[1] + " " + k));
        }
    }
}
