package dev.terrace.cli;

import org.junit.jupiter.api.Test;
import picocli.CommandLine;

import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The one-line summaries {@code terrace --help} lists are whole sentences. */
class HelpTextTest {

    @Test
    void everyCommandSummaryIsAWholeSentence() {
        for (Map.Entry<String, CommandLine> e : Main.commandLine().getSubcommands().entrySet()) {
            CommandLine.Model.UsageMessageSpec um = e.getValue().getCommandSpec().usageMessage();
            // picocli lists a command by its header when it has one, else by its first description line
            String[] d = um.header().length > 0 ? um.header() : um.description();
            assertTrue(d.length > 0, e.getKey());
            String first = d[0].strip();
            assertTrue(first.endsWith("."), () -> e.getKey() + ": summary ends mid-sentence: " + first);
            assertTrue(Character.isUpperCase(first.charAt(0)), () -> e.getKey() + ": " + first);
        }
    }

    @Test
    void demoHelpSaysWhatTheDemoDoes() {
        String[] d = Main.commandLine().getSubcommands().get("demo").getCommandSpec().usageMessage().description();
        for (String step : new String[] {"check", "fit", "propose", "report"}) {
            assertTrue(d[0].contains(step), () -> "demo summary names '" + step + "': " + d[0]);
        }
    }

    @Test
    void onlyTheFirstSentenceIsJoined() {
        assertArrayEquals(new String[] {"One sentence over two lines.", "Second paragraph."},
                Main.firstSentenceJoined(new String[] {"One sentence", "over two lines.", "Second paragraph."}));
        assertArrayEquals(new String[] {"Short.", "Rest"}, Main.firstSentenceJoined(new String[] {"Short.", "Rest"}));
    }
}
