package org.viscarta.map;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.apache.commons.csv.CSVRecord;
import org.viscarta.io.InputException;
import org.viscarta.sweep.Quantity;
import org.viscarta.sweep.Unit;

/**
 * The named columns of a small CSV the map reads (landmarks, regions, a legend): each found by its
 * name whatever the case, a length column with its unit in brackets ("x [µm]"), converted to metres.
 */
final class Columns {

    /** Comma separated, a header row, '#' lines comments, spaces around cells ignored. */
    static final org.apache.commons.csv.CSVFormat FORMAT = org.apache.commons.csv.CSVFormat.DEFAULT.builder().setCommentMarker('#')
            .setHeader().setSkipHeaderRecord(true).setIgnoreSurroundingSpaces(true).get();

    private static final Pattern HEADER = Pattern.compile("^\\s*([^\\[(]+?)\\s*(?:[\\[(]\\s*(.*?)\\s*[\\])])?\\s*$");

    private final Path file;
    private final int[] index;
    private final double[] toSi;
    private final String[] names;

    private Columns(Path file, int[] index, double[] toSi, String[] names) {
        this.file = file;
        this.index = index;
        this.toSi = toSi;
        this.names = names;
    }

    /**
     * Finds the named columns; a name ending in "?" is optional (index −1 when absent). Columns named
     * x or y must give a length unit.
     */
    static Columns of(Path file, List<String> header, String... wanted) {
        int[] index = new int[wanted.length];
        double[] toSi = new double[wanted.length];
        String[] names = new String[wanted.length];
        for (int w = 0; w < wanted.length; w++) {
            boolean optional = wanted[w].endsWith("?");
            String name = optional ? wanted[w].substring(0, wanted[w].length() - 1) : wanted[w];
            names[w] = name;
            index[w] = -1;
            toSi[w] = 1;
            for (int c = 0; c < header.size(); c++) {
                Matcher m = HEADER.matcher(header.get(c));
                if (!m.matches() || !m.group(1).strip().toLowerCase(Locale.ROOT).replace(' ', '_').equals(name)) {
                    continue;
                }
                index[w] = c;
                if (name.equals("x") || name.equals("y")) {
                    String unit = m.group(2) == null ? "" : m.group(2);
                    toSi[w] = Unit.find(unit, Quantity.Dimension.LENGTH).map(Unit::toSi).orElseThrow(() -> new InputException(file, 1,
                            0, "column '" + header.get(0) + "…': '" + name + "' needs a length unit, e.g. '" + name + " [µm]'"));
                }
            }
            if (index[w] < 0 && !optional) {
                throw new InputException(file, 1, 0, "no '" + name + "' column; the header names " + String.join(", ", header));
            }
        }
        return new Columns(file, index, toSi, names);
    }

    boolean has(int column) {
        return index[column] >= 0;
    }

    String text(CSVRecord r, int column, int line) {
        if (index[column] >= r.size()) {
            throw new InputException(file, line, index[column] + 1, "the row has no '" + names[column] + "' cell");
        }
        return r.get(index[column]).strip();
    }

    double number(CSVRecord r, int column, int line) {
        String t = text(r, column, line);
        try {
            double v = Double.parseDouble(t);
            if (Double.isFinite(v)) {
                return v;
            }
        } catch (NumberFormatException e) {
            // said below
        }
        throw new InputException(file, line, index[column] + 1, "'" + t + "' in column '" + names[column] + "' is not a number");
    }

    /** A length in metres. */
    double length(CSVRecord r, int column, int line) {
        return number(r, column, line) * toSi[column];
    }
}
