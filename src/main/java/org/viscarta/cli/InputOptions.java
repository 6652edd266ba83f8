package org.viscarta.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.Inputs;
import picocli.CommandLine;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Parameters;

/** The inputs every verb takes, and how to read them. */
final class InputOptions {

    @Parameters(paramLabel = "INPUT", arity = "1..*",
            description = "Sweep tables (CSV, TSV, XLSX, XLS) or folders, read recursively.")
    List<Path> inputs = new ArrayList<>();

    @Mixin
    ReadOptions read;

    /** A request for these inputs, read as the options say. */
    AnalysisRequest.Builder request() {
        return read.applyTo(AnalysisRequest.builder(inputs));
    }

    /** The inputs read as the options say, their warnings printed (for the verbs that work on samples directly). */
    Inputs readAndWarn(CommandLine.Model.CommandSpec spec) {
        Inputs c = Inputs.read(inputs, read.settings());
        Warnings.print(spec, c);
        return c;
    }
}
