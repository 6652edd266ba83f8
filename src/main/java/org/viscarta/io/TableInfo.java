package org.viscarta.io;

import java.util.List;
import java.util.Map;

/**
 * How a sweep table file was understood, for {@code inspect} and the report's provenance.
 *
 * @param kind        the layout
 * @param separator   the field separator found in the header line
 * @param decimalMark '.' or ','
 * @param encoding    UTF-8 or windows-1252
 * @param headerLine  1-based line of the header row
 * @param columns     every column and what it holds
 * @param metadata    the {@code # key: value} lines, keys in lower case
 */
public record TableInfo(Layout kind, char separator, char decimalMark, String encoding, int headerLine,
                        List<ColumnSpec> columns, Map<String, String> metadata) {

    public TableInfo {
        columns = List.copyOf(columns);
        metadata = org.viscarta.sweep.Metadata.inFileOrder(metadata);
    }

    /** The layout in words: "one sample per file", "tidy multi-sample table", ... */
    public String layout() {
        return kind.describe();
    }

    /** The separator named in words. */
    public String separatorName() {
        switch (separator) {
            case ',': return "comma";
            case ';': return "semicolon";
            case '\t': return "tab";
            default: return "'" + separator + "'";
        }
    }
}
