package org.viscarta.report;

import org.viscarta.analysis.AnalysisResult;

/**
 * What a report shows: one analysis result and the provenance of the run that made it.
 *
 * @param result     the analysis
 * @param provenance tool version, command line and run time
 */
public record ReportContent(AnalysisResult result, Provenance provenance) {
}
