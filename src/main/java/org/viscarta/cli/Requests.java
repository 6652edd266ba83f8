package org.viscarta.cli;

import java.util.function.Supplier;
import org.viscarta.analysis.AnalysisRequest;
import picocli.CommandLine;

/** Builds a verb's request; a setting the request refuses becomes a usage error that names it. */
final class Requests {

    private Requests() {
    }

    static AnalysisRequest build(CommandLine.Model.CommandSpec spec, Supplier<AnalysisRequest.Builder> options) {
        try {
            return options.get().build();
        } catch (IllegalArgumentException e) {
            throw new CommandLine.ParameterException(spec.commandLine(), e.getMessage());
        }
    }
}
