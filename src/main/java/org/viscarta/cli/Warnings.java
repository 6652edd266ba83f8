package org.viscarta.cli;

import java.io.PrintWriter;
import org.viscarta.Campaign;
import org.viscarta.io.ReadWarning;
import picocli.CommandLine;

/** Prints reading warnings and conversions on stderr. */
final class Warnings {

    private Warnings() {
    }

    static void print(CommandLine.Model.CommandSpec spec, Campaign campaign) {
        PrintWriter err = spec.commandLine().getErr();
        for (ReadWarning w : campaign.warnings()) {
            err.println("warning: " + w);
        }
        for (String n : campaign.notes()) {
            err.println("note: " + n);
        }
        err.flush();
    }
}
