package org.viscarta.serve;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicInteger;

import org.viscarta.analysis.AnalysisResult;
import org.viscarta.analysis.Progress;
import org.viscarta.report.RenderedFigure;

/** One analysis the workbench runs: its progress while running, then its result and report files. */
final class Job implements Progress {

    enum State { QUEUED, RUNNING, DONE, FAILED }

    /** What the page says of a stage (a switch, so that a new stage cannot go without its words). */
    private static String label(Stage s) {
        return switch (s) {
            case READING -> "reading the files";
            case CHECKING -> "checking quality";
            case TRANSITIONS -> "locating glass transitions";
            case MASTER_CURVES -> "building master curves";
            case FITTING -> "fitting models";
            case SPECTRA -> "computing relaxation spectra";
            case RANKING -> "ranking by damping";
            case MATCHING -> "matching against the library";
            case MAPS -> "analysing the maps";
            case DONE -> "analysis done";
        };
    }

    final String id;
    final Path folder;
    /** The folder the inputs were named relative to (an upload or the data folder), for messages. */
    final Path inputRoot;
    final long startedNanos = System.nanoTime();
    private volatile State state = State.QUEUED;
    private volatile Stage stage = Stage.READING;
    private volatile boolean writing;
    private volatile int items;
    private final AtomicInteger done = new AtomicInteger();
    private volatile String error;
    private volatile AnalysisResult result;
    private volatile List<RenderedFigure> figures = List.of();
    private volatile long finishedNanos;

    Job(String id, Path folder, Path inputRoot) {
        this.id = id;
        this.folder = folder;
        this.inputRoot = inputRoot;
    }

    @Override
    public void stage(Stage s, int n) {
        stage = s;
        items = n;
        done.set(0);
    }

    @Override
    public void step() {
        done.incrementAndGet();
    }

    void running() {
        state = State.RUNNING;
    }

    void writing() {
        writing = true;
    }

    void finished(AnalysisResult r, List<RenderedFigure> f) {
        result = r;
        figures = List.copyOf(f);
        finishedNanos = System.nanoTime();
        state = State.DONE;
    }

    void failed(String message) {
        error = message;
        finishedNanos = System.nanoTime();
        state = State.FAILED;
    }

    State state() {
        return state;
    }

    AnalysisResult result() {
        return result;
    }

    List<RenderedFigure> figures() {
        return figures;
    }

    Path report() {
        return folder.resolve("report");
    }

    /** The status the page polls. */
    Map<String, Object> status() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("id", id);
        m.put("state", state.name().toLowerCase(java.util.Locale.ROOT));
        int stages = Stage.values().length;
        double within = items > 0 ? Math.min(1.0, done.get() / (double) items) : 0;
        double fraction = switch (state) {
            case QUEUED -> 0;
            case DONE -> 1;
            case FAILED -> 0;
            case RUNNING -> writing ? 0.95 : 0.9 * (stage.ordinal() + within) / stages;
        };
        m.put("fraction", fraction);
        m.put("stage", writing ? "writing the workbook, page and figures" : label(stage));
        m.put("steps_done", done.get());
        m.put("steps", items);
        long end = finishedNanos != 0 ? finishedNanos : System.nanoTime();
        m.put("seconds", Math.round((end - startedNanos) / 1e7) / 100.0);
        if (error != null) {
            m.put("error", error);
        }
        return m;
    }
}
