package org.viscarta.serve;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.security.MessageDigest;
import java.security.SecureRandom;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Base64;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Properties;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import java.util.stream.Stream;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;

import com.fasterxml.jackson.core.JacksonException;
import com.fasterxml.jackson.databind.ObjectMapper;

import io.javalin.Javalin;
import io.javalin.config.SizeUnit;
import io.javalin.http.Context;
import io.javalin.http.Cookie;
import io.javalin.http.SameSite;
import io.javalin.http.UploadedFile;

import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.analysis.Inputs;
import org.viscarta.analysis.ReadSettings;
import org.viscarta.io.ColumnSpec;
import org.viscarta.io.InputCollector;
import org.viscarta.io.InputException;
import org.viscarta.io.ReadWarning;
import org.viscarta.io.SweepReader;
import org.viscarta.io.UsageException;
import org.viscarta.library.LibraryFolder;
import org.viscarta.library.ReferenceLibrary;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.report.Provenance;
import org.viscarta.report.RenderedFigure;
import org.viscarta.report.ReportContent;
import org.viscarta.report.ReportFiles;
import org.viscarta.sweep.SweepPoint;

/**
 * The workbench: a local web page on the same engine as the command line, served by Javalin (on
 * Jetty). Every request needs the access token made at start (in the printed address, then as a
 * cookie, or in the {@code X-Viscarta-Token} header for scripts). Uploads go to a private temporary
 * folder deleted at {@link #close()}; server folders can be read only below {@code --data}. The
 * page's scripts, styles and charting library come from the jar, under a strict
 * Content-Security-Policy.
 */
public final class Workbench implements AutoCloseable {

    /** The header a script sends the token in. */
    public static final String TOKEN_HEADER = "X-Viscarta-Token";
    static final String TOKEN_COOKIE = "viscarta-token";
    static final String CSP = "default-src 'none'; script-src 'self'; style-src 'self'; img-src 'self' data: blob:; "
            + "connect-src 'self'; font-src 'self'; form-action 'self'; frame-ancestors 'none'; base-uri 'none'";
    private static final int MAX_FILES = 20_000;
    private static final int MAX_JOBS_KEPT = 50;

    /**
     * @param host           the address to bind (127.0.0.1 unless a lab network is served)
     * @param port           the port, 0 for any free one
     * @param library        the reference library folder, or null
     * @param data           the folder the page may read below, or null
     * @param maxUploadBytes the largest upload (all files of one request together)
     * @param parallel       how many analyses run at once
     */
    public record Options(String host, int port, Path library, Path data, long maxUploadBytes, int parallel) {
    }

    private final Options options;
    private final String token;
    private final Path work;
    private final ExecutorService runner;
    private final Map<String, Path> uploads = new ConcurrentHashMap<>();
    private final Map<String, Job> jobs = new ConcurrentHashMap<>();
    private final AtomicLong counter = new AtomicLong();
    private final ObjectMapper json = new ObjectMapper();
    private final Javalin app;
    private final Properties about = new Properties();

    /** Starts the server. */
    public Workbench(Options options) throws IOException {
        this.options = options;
        byte[] random = new byte[24];
        new SecureRandom().nextBytes(random);
        this.token = Base64.getUrlEncoder().withoutPadding().encodeToString(random);
        Path tmp;
        try {
            tmp = Files.createTempDirectory("viscarta-workbench-", PosixFilePermissions.asFileAttribute(
                    PosixFilePermissions.fromString("rwx------")));
        } catch (UnsupportedOperationException e) {
            tmp = Files.createTempDirectory("viscarta-workbench-");
        }
        this.work = tmp;
        Files.createDirectories(work.resolve("multipart"));
        try (InputStream in = Workbench.class.getResourceAsStream("/org/viscarta/version.properties")) {
            if (in != null) {
                about.load(in);
            }
        }
        this.runner = Executors.newFixedThreadPool(Math.max(1, options.parallel()), r -> {
            Thread t = new Thread(r, "viscarta-analysis");
            t.setDaemon(true);
            return t;
        });
        this.app = Javalin.create(config -> {
            config.startup.showJavalinBanner = false;
            config.startup.showOldJavalinVersionWarning = false;
            config.jetty.host = options.host();
            config.jetty.port = options.port();
            config.http.maxRequestSize = 1_000_000;
            config.jetty.multipartConfig.cacheDirectory(work.resolve("multipart").toString());
            config.jetty.multipartConfig.maxFileSize(options.maxUploadBytes(), SizeUnit.BYTES);
            config.jetty.multipartConfig.maxTotalRequestSize(options.maxUploadBytes(), SizeUnit.BYTES);
            config.jetty.multipartConfig.maxInMemoryFileSize(1, SizeUnit.MB);
            config.routes.before(this::guard);
            config.routes.get("/", ctx -> asset(ctx, "/org/viscarta/serve/web/index.html", "text/html; charset=utf-8"));
            config.routes.get("/assets/app.js", ctx -> asset(ctx, "/org/viscarta/serve/web/app.js", "text/javascript; charset=utf-8"));
            config.routes.get("/assets/app.css", ctx -> asset(ctx, "/org/viscarta/serve/web/app.css", "text/css; charset=utf-8"));
            config.routes.get("/assets/icon.svg", ctx -> asset(ctx, "/org/viscarta/serve/web/icon.svg", "image/svg+xml"));
            config.routes.get("/favicon.ico", ctx -> asset(ctx, "/org/viscarta/serve/web/icon.svg", "image/svg+xml"));
            config.routes.get("/assets/uplot.js", ctx -> asset(ctx, uplot("uPlot.iife.min.js"), "text/javascript; charset=utf-8"));
            config.routes.get("/assets/uplot.css", ctx -> asset(ctx, uplot("uPlot.min.css"), "text/css; charset=utf-8"));
            config.routes.get("/api/about", this::aboutJson);
            config.routes.post("/api/uploads", this::upload);
            config.routes.delete("/api/uploads/{id}", this::dropUpload);
            config.routes.get("/api/data", this::listData);
            config.routes.post("/api/inspect", this::inspect);
            config.routes.post("/api/analyses", this::startAnalysis);
            config.routes.get("/api/analyses/{id}", ctx -> ctx.json(job(ctx).status()));
            config.routes.get("/api/analyses/{id}/result", this::result);
            config.routes.get("/api/analyses/{id}/files/{name}", this::download);
            config.routes.get("/api/analyses/{id}/figures/{name}", this::figure);
            config.routes.get("/api/library", this::libraryList);
            config.routes.get("/api/library/{name}", this::libraryShow);
            config.routes.post("/api/library", this::libraryAdd);
            config.routes.delete("/api/library/{name}", this::libraryRemove);
            config.routes.exception(ApiError.class, (e, ctx) -> fail(ctx, e.status(), e.getMessage()));
            config.routes.exception(InputException.class, (e, ctx) -> fail(ctx, 400, e.getMessage()));
            config.routes.exception(UsageException.class, (e, ctx) -> fail(ctx, 400, e.getMessage()));
            config.routes.exception(JacksonException.class, (e, ctx) -> fail(ctx, 400,
                    "the request's JSON could not be read: " + InputException.oneLine(e.getOriginalMessage())));
            config.routes.exception(Exception.class, (e, ctx) -> {
                String m = String.valueOf(e.getMessage());
                if (m.contains("exceeds") || m.contains("too large") || m.contains("Max") || m.contains("max")) {
                    fail(ctx, 413, "the upload is larger than this server accepts (" + (options.maxUploadBytes() >> 20)
                            + " MB; start it with a larger --max-upload)");
                } else {
                    fail(ctx, 500, "internal error: " + e.getClass().getSimpleName() + ": " + InputException.oneLine(m));
                }
            });
            config.routes.error(404, ctx -> {
                if (ctx.result() == null || !ctx.result().startsWith("{")) {
                    fail(ctx, 404, "no such page or resource: " + ctx.path());
                }
            });
        }).start();
    }

    /** The port served. */
    public int port() {
        return app.port();
    }

    /** The access token. */
    public String token() {
        return token;
    }

    /** The address to open, with the token. */
    public String address() {
        String host = options.host().contains(":") ? "[" + options.host() + "]" : options.host();
        if (host.equals("0.0.0.0")) {
            host = "127.0.0.1";
        }
        return "http://" + host + ":" + port() + "/?token=" + token;
    }

    /** The private folder of uploads and results (deleted at close). */
    Path work() {
        return work;
    }

    @Override
    public void close() {
        app.stop();
        runner.shutdownNow();
        try {
            runner.awaitTermination(10, TimeUnit.SECONDS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        Uploads.deleteTree(work);
    }

    // --- access ---------------------------------------------------------------------------------

    private void guard(Context ctx) {
        ctx.header("Content-Security-Policy", CSP);
        ctx.header("X-Content-Type-Options", "nosniff");
        ctx.header("Referrer-Policy", "no-referrer");
        ctx.header("X-Frame-Options", "DENY");
        ctx.header("Cache-Control", "no-store");
        String header = ctx.header(TOKEN_HEADER);
        String query = ctx.queryParam("token");
        String cookie = ctx.cookie(TOKEN_COOKIE);
        String given = header != null ? header : query != null ? query : cookie;
        if (given == null || given.isEmpty()) {
            throw new ApiError(401, "this server needs its access token: open the address 'viscarta serve' printed (it ends "
                    + "in ?token=...), or send the token in the " + TOKEN_HEADER + " header");
        }
        if (!MessageDigest.isEqual(given.getBytes(StandardCharsets.UTF_8), token.getBytes(StandardCharsets.UTF_8))) {
            throw new ApiError(403, "wrong access token: open the address 'viscarta serve' printed when it started");
        }
        if (query != null && !token.equals(cookie)) {
            Cookie c = new Cookie(TOKEN_COOKIE, token);
            c.setHttpOnly(true);
            c.setSameSite(SameSite.STRICT);
            c.setPath("/");
            ctx.cookie(c);
        }
        if (query != null && ctx.path().equals("/") && ctx.method().name().equals("GET")) {
            ctx.redirect("/");
            ctx.skipRemainingHandlers();
        }
    }

    private static void fail(Context ctx, int status, String message) {
        ctx.status(status);
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("error", message);
        m.put("status", status);
        ctx.json(m);
    }

    // --- static assets --------------------------------------------------------------------------

    private String uplot(String file) {
        return "/META-INF/resources/webjars/uplot/" + about.getProperty("uplot.version", "") + "/dist/" + file;
    }

    private static void asset(Context ctx, String resource, String type) throws IOException {
        try (InputStream in = Workbench.class.getResourceAsStream(resource)) {
            if (in == null) {
                throw ApiError.notFound("missing from the jar: " + resource);
            }
            ctx.contentType(type);
            ctx.result(in.readAllBytes());
        }
    }

    private void aboutJson(Context ctx) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("version", about.getProperty("version", "unknown"));
        m.put("library", options.library() == null ? null : String.valueOf(options.library().getFileName()));
        m.put("data", options.data() != null);
        m.put("max_upload_mb", options.maxUploadBytes() / (1024.0 * 1024.0));
        m.put("models", ModelCatalogue.ids());
        ctx.json(m);
    }

    // --- inputs ---------------------------------------------------------------------------------

    private void upload(Context ctx) throws IOException {
        long length = ctx.req().getContentLengthLong();
        if (length > options.maxUploadBytes()) {
            throw new ApiError(413, String.format(Locale.ROOT, "the upload (%.1f MB) is larger than this server accepts (%.1f MB; "
                    + "start it with a larger --max-upload)", length / 1048576.0, options.maxUploadBytes() / 1048576.0));
        }
        String type = ctx.contentType();
        if (type == null || !type.toLowerCase(Locale.ROOT).startsWith("multipart/form-data")) {
            throw ApiError.badRequest("send the files as multipart/form-data, each in a part named 'files'");
        }
        List<UploadedFile> files = ctx.uploadedFiles("files");
        List<String> names = ctx.formParams("paths");
        if (files.isEmpty()) {
            throw ApiError.badRequest("no files in the upload (parts named 'files')");
        }
        if (files.size() > MAX_FILES) {
            throw new ApiError(413, "more than " + MAX_FILES + " files in one upload");
        }
        List<Path> relative = new ArrayList<>();
        for (int i = 0; i < files.size(); i++) {
            relative.add(Uploads.safeRelative(i < names.size() && !names.get(i).isBlank() ? names.get(i) : files.get(i).filename()));
        }
        String id = "u" + counter.incrementAndGet();
        Path dir = Files.createDirectory(work.resolve("upload-" + id));
        List<String> kept = new ArrayList<>();
        try {
            for (int i = 0; i < files.size(); i++) {
                Path target = dir.resolve(relative.get(i)).normalize();
                if (!target.startsWith(dir)) {
                    throw ApiError.badRequest("'" + relative.get(i) + "' steps out of the upload");
                }
                Files.createDirectories(target.getParent());
                try (InputStream in = files.get(i).content()) {
                    Files.copy(in, target);
                }
                kept.add(dir.relativize(target).toString().replace('\\', '/'));
            }
        } catch (RuntimeException | IOException e) {
            Uploads.deleteTree(dir);
            if (e instanceof java.nio.file.FileAlreadyExistsException) {
                throw ApiError.badRequest("the same file name was sent twice: " + Uploads.relative(e.getMessage(), dir));
            }
            throw e;
        }
        uploads.put(id, dir);
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("upload", id);
        m.put("files", kept);
        ctx.status(201).json(m);
    }

    private void dropUpload(Context ctx) {
        Path dir = uploads.remove(ctx.pathParam("id"));
        if (dir == null) {
            throw ApiError.notFound("no upload '" + ctx.pathParam("id") + "'");
        }
        Uploads.deleteTree(dir);
        ctx.status(204);
    }

    private void listData(Context ctx) throws IOException {
        if (options.data() == null) {
            throw ApiError.forbidden("this server reads no server folders: start it with --data DIR to allow those below DIR");
        }
        Path dir = Uploads.inside(options.data(), ctx.queryParam("path"));
        if (!Files.isDirectory(dir)) {
            throw ApiError.badRequest("'" + ctx.queryParam("path") + "' is not a folder");
        }
        Path root = options.data().toRealPath();
        List<String> folders = new ArrayList<>();
        List<String> files = new ArrayList<>();
        try (Stream<Path> s = Files.list(dir)) {
            for (Path p : s.sorted().toList()) {
                String name = p.getFileName().toString();
                if (name.startsWith(".")) {
                    continue;
                }
                (Files.isDirectory(p) ? folders : files).add(name);
            }
        }
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("path", root.relativize(dir).toString().replace('\\', '/'));
        m.put("folders", folders);
        m.put("files", files);
        ctx.json(m);
    }

    /** Where the inputs of a request are: an upload or a folder below --data. */
    private record Source(List<Path> inputs, Path root, List<String> names) {
    }

    private Source source(Map<String, Object> body) throws IOException {
        Object upload = body.get("upload");
        Object data = body.get("data");
        if ((upload == null) == (data == null)) {
            throw ApiError.badRequest("name the inputs: either \"upload\" (an upload's id) or \"data\" (a folder below --data)");
        }
        if (upload != null) {
            Path dir = uploads.get(String.valueOf(upload));
            if (dir == null) {
                throw ApiError.notFound("no upload '" + upload + "' (uploads last until the server stops)");
            }
            return new Source(List.of(dir), dir, List.of("(uploaded files)"));
        }
        if (options.data() == null) {
            throw ApiError.forbidden("this server reads no server folders: start it with --data DIR to allow those below DIR");
        }
        Path dir = Uploads.inside(options.data(), String.valueOf(data));
        Path root = options.data().toRealPath();
        String name = root.relativize(dir).toString();
        return new Source(List.of(dir), root, List.of(name.isEmpty() ? "." : name));
    }

    @SuppressWarnings("unchecked")
    private Map<String, Object> body(Context ctx) throws IOException {
        String text = ctx.body();
        if (text.isBlank()) {
            throw ApiError.badRequest("the request needs a JSON body");
        }
        Object o = json.readValue(text, Object.class);
        if (!(o instanceof Map)) {
            throw ApiError.badRequest("the request's JSON must be an object");
        }
        return (Map<String, Object>) o;
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> settingsOf(Map<String, Object> body) {
        Object s = body.get("settings");
        if (s != null && !(s instanceof Map)) {
            throw ApiError.badRequest("\"settings\" must be an object");
        }
        return s == null ? Map.of() : (Map<String, Object>) s;
    }

    private void inspect(Context ctx) throws IOException {
        Map<String, Object> body = body(ctx);
        Source src = source(body);
        ReadSettings settings = new Settings(settingsOf(body)).reading();
        List<Path> files = InputCollector.collect(src.inputs());
        List<Map<String, Object>> read = new ArrayList<>();
        List<Map<String, Object>> leftOut = new ArrayList<>();
        for (Path f : files) {
            String name = src.root().relativize(f).toString().replace('\\', '/');
            try {
                read.add(summary(name, Inputs.summarize(f, settings), src.root()));
            } catch (InputException e) {
                Map<String, Object> m = new LinkedHashMap<>();
                m.put("file", name);
                m.put("message", Uploads.relative(e.getMessage(), src.root()));
                leftOut.add(m);
            }
        }
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("files", read);
        m.put("left_out", leftOut);
        ctx.json(m);
    }

    private static Map<String, Object> summary(String name, SweepReader.Summary s, Path root) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("file", name);
        m.put("layout", s.info().layout());
        m.put("separator", s.info().separatorName());
        m.put("decimal_mark", String.valueOf(s.info().decimalMark()));
        m.put("encoding", s.info().encoding());
        m.put("header_line", s.info().headerLine());
        List<Map<String, Object>> cols = new ArrayList<>();
        for (ColumnSpec c : s.info().columns()) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("column", c.index() + 1);
            x.put("header", c.header());
            x.put("understood_as", c.describe());
            cols.add(x);
        }
        m.put("columns", cols);
        m.put("metadata", s.info().metadata());
        List<Map<String, Object>> sweeps = new ArrayList<>();
        for (SweepReader.SweepSummary w : s.sweeps()) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("sample", w.sample());
            x.put("replicate", w.replicate());
            x.put("group", w.group());
            x.put("basis", w.kind().toString());
            x.put("points", w.points());
            x.put("frequency_min_hz", finite(w.minFrequencyHz()));
            x.put("frequency_max_hz", finite(w.maxFrequencyHz()));
            x.put("temperature_c", finite(w.temperatureC()));
            x.put("test", w.test().isEmpty() ? null : w.test());
            sweeps.add(x);
        }
        m.put("sweeps", sweeps);
        List<String> warnings = new ArrayList<>();
        for (ReadWarning w : s.warnings()) {
            warnings.add(Uploads.relative(w.toString(), root));
        }
        m.put("warnings", warnings);
        return m;
    }

    private static Double finite(double v) {
        return Double.isFinite(v) ? v : null;
    }

    // --- analyses -------------------------------------------------------------------------------

    private void startAnalysis(Context ctx) throws IOException {
        Map<String, Object> body = body(ctx);
        Source src = source(body);
        Settings settings = new Settings(settingsOf(body));
        AnalysisRequest request = settings.report(src.inputs(), options.library());
        String id = "a" + counter.incrementAndGet();
        Job job = new Job(id, Files.createDirectory(work.resolve("analysis-" + id)), src.root());
        String commandLine = settings.asCommandLine(src.names(), options.library());
        jobs.put(id, job);
        forgetOldJobs();
        runner.submit(() -> run(job, request, commandLine));
        ctx.status(202).json(job.status());
    }

    private void run(Job job, AnalysisRequest request, String commandLine) {
        job.running();
        try {
            AnalysisResult result = Analysis.run(request, job);
            job.writing();
            Provenance provenance = new Provenance(about.getProperty("version", "unknown"), commandLine,
                    Instant.now().truncatedTo(ChronoUnit.SECONDS).toString());
            List<RenderedFigure> figures = new ReportFiles(job.report()).write(new ReportContent(result, provenance), true).figures();
            job.finished(result, figures);
        } catch (InputException | UsageException | ApiError e) {
            job.failed(Uploads.relative(e.getMessage(), job));
        } catch (RuntimeException | IOException | Error e) {
            job.failed("internal error: " + e.getClass().getSimpleName() + ": " + InputException.oneLine(String.valueOf(e.getMessage())));
        }
    }

    private void forgetOldJobs() {
        if (jobs.size() <= MAX_JOBS_KEPT) {
            return;
        }
        jobs.values().stream().filter(j -> j.state() == Job.State.DONE || j.state() == Job.State.FAILED)
                .sorted(java.util.Comparator.comparingLong(j -> j.startedNanos)).limit(jobs.size() - MAX_JOBS_KEPT)
                .toList().forEach(j -> {
                    jobs.remove(j.id);
                    Uploads.deleteTree(j.folder);
                });
    }

    private Job job(Context ctx) {
        Job j = jobs.get(ctx.pathParam("id"));
        if (j == null) {
            throw ApiError.notFound("no analysis '" + ctx.pathParam("id") + "'");
        }
        return j;
    }

    private Job finishedJob(Context ctx) {
        Job j = job(ctx);
        if (j.state() == Job.State.FAILED) {
            throw new ApiError(409, "the analysis failed: " + j.status().get("error"));
        }
        if (j.state() != Job.State.DONE) {
            throw new ApiError(409, "the analysis is still running; ask again when its state is 'done'");
        }
        return j;
    }

    private void result(Context ctx) {
        ctx.json(ResultJson.of(finishedJob(ctx)));
    }

    private void download(Context ctx) throws IOException {
        Job j = finishedJob(ctx);
        String name = ctx.pathParam("name");
        Path report = j.report();
        switch (name) {
            case "report.xlsx" -> send(ctx, report.resolve("report.xlsx"), name,
                    "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet");
            case "report.html" -> send(ctx, report.resolve("report.html"), name, "text/html; charset=utf-8");
            case "figures.zip" -> zip(ctx, report.resolve("figures"), "viscarta-figures.zip", "figures/");
            case "all.zip" -> zip(ctx, report, "viscarta-report.zip", "");
            default -> throw ApiError.notFound("no download '" + name + "': report.xlsx, report.html, figures.zip or all.zip");
        }
    }

    private void figure(Context ctx) throws IOException {
        Job j = finishedJob(ctx);
        String name = ctx.pathParam("name");
        if (!name.matches("[A-Za-z0-9._-]+\\.(png|svg)") || name.startsWith(".")) {
            throw ApiError.badRequest("a figure is named like 'ranking.png' or 'ranking.svg'");
        }
        Path f = j.report().resolve("figures").resolve(name).normalize();
        if (!f.startsWith(j.report().resolve("figures")) || !Files.isRegularFile(f)) {
            throw ApiError.notFound("no figure '" + name + "'");
        }
        ctx.contentType(name.endsWith(".png") ? "image/png" : "image/svg+xml");
        ctx.result(Files.readAllBytes(f));
    }

    private static void send(Context ctx, Path file, String name, String type) throws IOException {
        ctx.contentType(type);
        ctx.header("Content-Disposition", "attachment; filename=\"" + name + "\"");
        ctx.result(Files.readAllBytes(file));
    }

    private static void zip(Context ctx, Path folder, String name, String prefix) throws IOException {
        java.io.ByteArrayOutputStream buffer = new java.io.ByteArrayOutputStream();
        try (ZipOutputStream z = new ZipOutputStream(buffer); Stream<Path> s = Files.walk(folder)) {
            for (Path p : s.filter(Files::isRegularFile).sorted().toList()) {
                String entry = prefix + folder.relativize(p).toString().replace('\\', '/');
                if (entry.contains("/.") || entry.startsWith(".")) {
                    continue;
                }
                z.putNextEntry(new ZipEntry(entry));
                Files.copy(p, z);
                z.closeEntry();
            }
        }
        ctx.contentType("application/zip");
        ctx.header("Content-Disposition", "attachment; filename=\"" + name + "\"");
        ctx.result(buffer.toByteArray());
    }

    // --- library --------------------------------------------------------------------------------

    private Path libraryFolder() {
        if (options.library() == null) {
            throw ApiError.notFound("this server has no reference library: start it with --library DIR");
        }
        return options.library();
    }

    private void libraryList(Context ctx) {
        ReferenceLibrary lib = ReferenceLibrary.open(libraryFolder());
        List<Map<String, Object>> out = new ArrayList<>();
        for (ReferenceLibrary.Entry e : lib.entries()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("name", e.name());
            m.put("class", e.clazz());
            m.put("temperature", e.sweep().meta("temperature").orElse(""));
            m.put("method", e.sweep().meta("method").orElse(""));
            m.put("basis", e.sweep().kind().toString());
            m.put("frequency_min_hz", e.sweep().minFrequencyHz());
            m.put("frequency_max_hz", e.sweep().maxFrequencyHz());
            m.put("points", e.sweep().points().size());
            m.put("file", e.file().getFileName().toString());
            out.add(m);
        }
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("library", String.valueOf(libraryFolder().getFileName()));
        m.put("entries", out);
        ctx.json(m);
    }

    private void libraryShow(Context ctx) {
        String name = ctx.pathParam("name");
        ReferenceLibrary.Entry e = ReferenceLibrary.open(libraryFolder()).entries().stream().filter(x -> x.name().equals(name))
                .findFirst().orElseThrow(() -> ApiError.notFound("no reference named '" + name + "'"));
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("name", e.name());
        m.put("class", e.clazz());
        m.put("letter", e.sweep().kind().letter());
        m.put("file", e.file().getFileName().toString());
        m.put("sha256", e.sha256());
        m.put("metadata", new java.util.TreeMap<>(e.sweep().metadata()));
        List<SweepPoint> pts = e.sweep().points();
        m.put("frequency_hz", pts.stream().mapToDouble(SweepPoint::frequencyHz).toArray());
        m.put("storage_pa", pts.stream().mapToDouble(SweepPoint::storage).toArray());
        m.put("loss_pa", pts.stream().mapToDouble(SweepPoint::loss).toArray());
        ctx.json(m);
    }

    private void libraryAdd(Context ctx) throws IOException {
        Path folder = libraryFolder();
        long length = ctx.req().getContentLengthLong();
        if (length > options.maxUploadBytes()) {
            throw new ApiError(413, "the file is larger than this server accepts");
        }
        String type = ctx.contentType();
        if (type == null || !type.toLowerCase(Locale.ROOT).startsWith("multipart/form-data")) {
            throw ApiError.badRequest("send the reference as multipart/form-data: a part 'file' and fields 'name', 'class', ...");
        }
        UploadedFile file = ctx.uploadedFile("file");
        if (file == null) {
            throw ApiError.badRequest("no file: send the sweep table in a part named 'file'");
        }
        String name = field(ctx, "name");
        String clazz = field(ctx, "class");
        if (name == null || clazz == null) {
            throw ApiError.badRequest("a reference needs a name and a class (gel, tissue, paint film, varnish, ...)");
        }
        Path dir = Files.createDirectory(work.resolve("library-add-" + counter.incrementAndGet()));
        try {
            Path source = dir.resolve(Uploads.safeRelative(file.filename()).getFileName());
            try (InputStream in = file.content()) {
                Files.copy(in, source);
            }
            Map<String, Object> reading = new LinkedHashMap<>();
            if (field(ctx, "modulus") != null) {
                reading.put("modulus", field(ctx, "modulus"));
            }
            ReadSettings rs = new Settings(reading).reading();
            LibraryFolder.Added added;
            try {
                added = new LibraryFolder(folder).add(source, new LibraryFolder.Additions(name, clazz, field(ctx, "composition"),
                        field(ctx, "condition"), field(ctx, "notes"), field(ctx, "temperature"), field(ctx, "method")),
                        "true".equalsIgnoreCase(field(ctx, "replace")), new SweepReader(rs.declaredKind().orElse(null), rs.columns()),
                        rs.declaredKind().isPresent());
            } catch (InputException e) {
                throw ApiError.badRequest(Uploads.relative(e.getMessage(), dir));
            }
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("added", name);
            m.put("file", added.file().getFileName().toString());
            m.put("warnings", added.warnings().stream().map(w -> Uploads.relative(w, dir)).toList());
            ctx.status(201).json(m);
        } finally {
            Uploads.deleteTree(dir);
        }
    }

    private static String field(Context ctx, String name) {
        String v = ctx.formParam(name);
        return v == null || v.isBlank() ? null : v.strip();
    }

    private void libraryRemove(Context ctx) throws IOException {
        String name = ctx.pathParam("name");
        if (ReferenceLibrary.open(libraryFolder()).entries().stream().noneMatch(e -> e.name().equals(name))) {
            throw ApiError.notFound("no reference named '" + name + "'");
        }
        Path kept = new LibraryFolder(libraryFolder()).remove(name);
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("removed", name);
        m.put("kept_as", libraryFolder().relativize(kept).toString().replace('\\', '/'));
        ctx.json(m);
    }
}
