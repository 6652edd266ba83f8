package org.viscarta.report;

/**
 * What a reader needs to trace a result back, beyond the request's settings (which
 * {@link org.viscarta.analysis.Statements#settings} states): the tool version, the exact command
 * line, and when it ran (UTC).
 *
 * @param toolVersion Viscarta's version
 * @param commandLine the full command line as typed (arguments quoted where they hold spaces)
 * @param runAtUtc    ISO-8601 UTC time of the run
 */
public record Provenance(String toolVersion, String commandLine, String runAtUtc) {

    /** A command line as a shell would take it back: each argument quoted where it holds spaces or quotes. */
    public static String quote(String program, java.util.List<String> args) {
        StringBuilder sb = new StringBuilder(program);
        for (String a : args) {
            sb.append(' ').append(a.isEmpty() || a.matches(".*[\\s\"'].*") ? "'" + a.replace("'", "'\\''") + "'" : a);
        }
        return sb.toString();
    }
}
