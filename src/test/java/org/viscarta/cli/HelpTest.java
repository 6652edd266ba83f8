package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

/** Regression: every verb's help reads right at 80 columns: no library warning, no ragged re-wrapping, no split option value. */
@Tag("regression")
class HelpTest {

    private static List<CommandLine> everyCommand(CommandLine cl) {
        List<CommandLine> out = new ArrayList<>(List.of(cl));
        for (Map.Entry<String, CommandLine> e : cl.getSubcommands().entrySet()) {
            if (!e.getKey().equals("help")) {
                out.addAll(everyCommand(e.getValue()));
            }
        }
        return out;
    }

    @Test
    void everyHelpTextRendersCleanlyAtEightyColumns() {
        PrintStream saved = System.err;
        ByteArrayOutputStream warnings = new ByteArrayOutputStream();
        System.setErr(new PrintStream(warnings, true, StandardCharsets.UTF_8));
        try {
            for (CommandLine c : everyCommand(new CommandLine(new Viscarta()))) {
                c.setUsageHelpWidth(80);
                String help = c.getUsageMessage(CommandLine.Help.Ansi.OFF);
                String name = c.getCommandSpec().qualifiedName();
                List<String> lines = help.lines().toList();
                for (int i = 0; i + 1 < lines.size(); i++) {
                    String a = lines.get(i);
                    String b = lines.get(i + 1);
                    assertTrue(a.length() <= 80, name + ": line longer than 80 columns: " + a);
                    boolean continuation = !b.isEmpty() && Character.isLowerCase(b.charAt(0));
                    assertFalse(continuation && !a.startsWith(" ") && a.length() < 45,
                            name + ": ragged re-wrapping between\n" + a + "\n" + b);
                }
                for (CommandLine.Model.OptionSpec o : c.getCommandSpec().options()) {
                    assertTrue(help.contains(o.paramLabel()) || o.arity().max() == 0, name + ": " + o.paramLabel() + " is split");
                }
            }
        } finally {
            System.setErr(saved);
        }
        assertFalse(warnings.toString(StandardCharsets.UTF_8).contains("WARN"), warnings.toString(StandardCharsets.UTF_8));
    }
}
