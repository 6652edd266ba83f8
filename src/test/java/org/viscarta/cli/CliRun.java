package org.viscarta.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

/**
 * What one run of the command line gave.
 *
 * @param exitCode the exit code
 * @param out      standard output
 * @param err      standard error
 */
record CliRun(int exitCode, String out, String err) {

    static CliRun of(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Viscarta.execute(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new CliRun(code, out.toString(), err.toString());
    }
}
