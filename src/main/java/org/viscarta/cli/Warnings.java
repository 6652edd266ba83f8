package org.viscarta.cli;

import java.io.PrintWriter;
import org.viscarta.analysis.Inputs;
import org.viscarta.io.ReadWarning;
import picocli.CommandLine;

/** Prints reading warnings and conversions on stderr. */
final class Warnings {

    private Warnings() {
    }

    static void print(CommandLine.Model.CommandSpec spec, Inputs inputs) {
        PrintWriter err = spec.commandLine().getErr();
        for (ReadWarning w : inputs.warnings()) {
            err.println("warning: " + org.viscarta.io.InputException.oneLine(String.valueOf(w)));
        }
        for (String n : inputs.notes()) {
            err.println("note: " + org.viscarta.io.InputException.oneLine(n));
        }
        err.flush();
    }
}
