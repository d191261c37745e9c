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

    /**
     * Walks every command (and the root) and checks that each description paragraph and each
     * option's description is a whole sentence: it starts with a capital letter (or an option or
     * placeholder) and ends with a full stop, and no source line of a paragraph ends mid-sentence
     * in a way the help would print as a cut line.
     */
    @Test
    void everyDescriptionAndOptionTextIsWholeSentences() {
        java.util.List<String> bad = new java.util.ArrayList<>();
        CommandLine root = Main.commandLine();
        java.util.List<CommandLine> all = new java.util.ArrayList<>(java.util.List.of(root));
        for (int k = 0; k < all.size(); k++) {
            all.addAll(all.get(k).getSubcommands().values());
        }
        for (CommandLine cl : all) {
            String name = cl.getCommandName();
            for (String line : cl.getCommandSpec().usageMessage().description()) {
                String t = line.replace("%n", "").strip(); // picocli's line-break marker
                if (!t.isEmpty() && !(t.endsWith(".") || t.endsWith(":"))) {
                    bad.add(name + ": description line ends mid-sentence: " + t);
                }
            }
            for (CommandLine.Model.OptionSpec o : cl.getCommandSpec().options()) {
                String text = String.join(" ", o.description()).strip();
                if (text.isEmpty() || !(text.endsWith(".") || text.endsWith(".)"))) {
                    bad.add(name + " " + o.longestName() + ": option text is not a whole sentence: " + text);
                }
            }
            for (CommandLine.Model.PositionalParamSpec p : cl.getCommandSpec().positionalParameters()) {
                String text = String.join(" ", p.description()).strip();
                if (!text.isEmpty() && !text.endsWith(".")) {
                    bad.add(name + " " + p.paramLabel() + ": parameter text is not a whole sentence: " + text);
                }
            }
        }
        assertTrue(bad.isEmpty(), () -> String.join("\n", bad));
    }

    @Test
    void demoHelpSaysWhatTheDemoDoes() {
        String[] d = Main.commandLine().getSubcommands().get("demo").getCommandSpec().usageMessage().description();
        for (String step : new String[] {"check", "fit", "propose", "journal", "record", "report"}) {
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
