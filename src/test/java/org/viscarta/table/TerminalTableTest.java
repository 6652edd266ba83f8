package org.viscarta.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/** A terminal table wider than 100 columns wraps its roomiest column and loses no text. */
@Tag("regression")
class TerminalTableTest {

    @Test
    void aLongNameWrapsWithinOneHundredColumnsAndKeepsEveryCharacter() {
        List<String[]> rows = new ArrayList<>();
        rows.add(new String[] {"rank", "sample", "group", "a long numeric header [unit]", "another long header [unit]"});
        String name = "polyacrylamide-8pct-batch-2024-11-03 (relaxation)";
        rows.add(new String[] {"1", name, "polyacrylamide", "0.1234", "0.5678"});
        rows.add(new String[] {"2", "short", "gel", "0.1", "0.2"});
        StringWriter sw = new StringWriter();
        TerminalTable.print(rows, new PrintWriter(sw));
        List<String> lines = sw.toString().lines().toList();
        lines.forEach(l -> assertTrue(l.length() <= 100, "within 100 columns: " + l));
        assertTrue(lines.size() > 4, "the long name continues on a line of its own: " + lines);
        String joined = String.join("", lines.subList(2, lines.size() - 1).stream().map(l -> l.substring(6, Math.min(l.length(),
                6 + lines.get(0).indexOf("group") - 6)).strip()).toList());
        assertEquals(name.replace(" ", ""), joined.replace(" ", ""), "every character of the name is printed");
        assertTrue(lines.get(2).contains("0.1234"), "the row's other cells stay on its first line");
    }

    @Test
    void aNarrowTableIsUntouched() {
        List<String[]> rows = List.of(new String[] {"a", "b"}, new String[] {"one", "two"});
        StringWriter sw = new StringWriter();
        TerminalTable.print(rows, new PrintWriter(sw));
        assertEquals(List.of("a    b", "--------", "one  two"), sw.toString().lines().toList());
    }
}
