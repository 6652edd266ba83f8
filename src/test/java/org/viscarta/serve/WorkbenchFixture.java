package org.viscarta.serve;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.stream.Stream;

import com.fasterxml.jackson.databind.ObjectMapper;

/** A workbench on a free port for tests, with a copy of the demo library, and a small HTTP client for its API. */
final class WorkbenchFixture implements AutoCloseable {

    final Workbench server;
    final Path library;
    final HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(10)).build();
    final ObjectMapper json = new ObjectMapper();

    WorkbenchFixture(Path scratch, Path data, long maxUpload) throws IOException {
        library = scratch.resolve("library");
        Files.createDirectories(library);
        try (Stream<Path> s = Files.list(Path.of("reference-materials"))) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                Files.copy(p, library.resolve(p.getFileName()));
            }
        }
        server = new Workbench(new Workbench.Options("127.0.0.1", 0, library, data, maxUpload, 2));
    }

    String base() {
        return "http://127.0.0.1:" + server.port();
    }

    HttpResponse<String> get(String path, String token) throws IOException, InterruptedException {
        HttpRequest.Builder b = HttpRequest.newBuilder(URI.create(base() + path)).timeout(Duration.ofSeconds(60)).GET();
        if (token != null) {
            b.header(Workbench.TOKEN_HEADER, token);
        }
        return http.send(b.build(), HttpResponse.BodyHandlers.ofString());
    }

    HttpResponse<byte[]> getBytes(String path) throws IOException, InterruptedException {
        return http.send(HttpRequest.newBuilder(URI.create(base() + path)).header(Workbench.TOKEN_HEADER, server.token())
                .timeout(Duration.ofSeconds(60)).GET().build(), HttpResponse.BodyHandlers.ofByteArray());
    }

    HttpResponse<String> send(String method, String path, String body) throws IOException, InterruptedException {
        return http.send(HttpRequest.newBuilder(URI.create(base() + path)).header(Workbench.TOKEN_HEADER, server.token())
                .header("Content-Type", "application/json").timeout(Duration.ofSeconds(60))
                .method(method, body == null ? HttpRequest.BodyPublishers.noBody() : HttpRequest.BodyPublishers.ofString(body)).build(),
                HttpResponse.BodyHandlers.ofString());
    }

    /** A multipart upload: each file under 'files', its relative name under 'paths'. */
    HttpResponse<String> upload(String path, Map<String, byte[]> files, Map<String, String> fields) throws IOException, InterruptedException {
        String boundary = "----viscarta" + UUID.randomUUID();
        ByteArrayOutputStream body = new ByteArrayOutputStream();
        for (Map.Entry<String, String> f : fields.entrySet()) {
            body.write(("--" + boundary + "\r\nContent-Disposition: form-data; name=\"" + f.getKey() + "\"\r\n\r\n" + f.getValue()
                    + "\r\n").getBytes(StandardCharsets.UTF_8));
        }
        String part = path.equals("/api/library") ? "file" : "files";
        for (Map.Entry<String, byte[]> f : files.entrySet()) {
            String name = f.getKey();
            String base = name.contains("/") ? name.substring(name.lastIndexOf('/') + 1) : name;
            if (!part.equals("file")) {
                body.write(("--" + boundary + "\r\nContent-Disposition: form-data; name=\"paths\"\r\n\r\n" + name + "\r\n")
                        .getBytes(StandardCharsets.UTF_8));
            }
            body.write(("--" + boundary + "\r\nContent-Disposition: form-data; name=\"" + part + "\"; filename=\"" + base
                    + "\"\r\nContent-Type: text/csv\r\n\r\n").getBytes(StandardCharsets.UTF_8));
            body.write(f.getValue());
            body.write("\r\n".getBytes(StandardCharsets.UTF_8));
        }
        body.write(("--" + boundary + "--\r\n").getBytes(StandardCharsets.UTF_8));
        return http.send(HttpRequest.newBuilder(URI.create(base() + path)).header(Workbench.TOKEN_HEADER, server.token())
                .header("Content-Type", "multipart/form-data; boundary=" + boundary).timeout(Duration.ofSeconds(60))
                .POST(HttpRequest.BodyPublishers.ofByteArray(body.toByteArray())).build(), HttpResponse.BodyHandlers.ofString());
    }

    /** Uploads these demo files (relative to the repository) and returns the upload's id. */
    String uploadFiles(List<String> files) throws IOException, InterruptedException {
        Map<String, byte[]> m = new java.util.LinkedHashMap<>();
        for (String f : files) {
            m.put(Path.of(f).getFileName().toString(), Files.readAllBytes(Path.of(f)));
        }
        HttpResponse<String> r = upload("/api/uploads", m, Map.of());
        if (r.statusCode() != 201) {
            throw new AssertionError(r.statusCode() + " " + r.body());
        }
        return String.valueOf(map(r.body()).get("upload"));
    }

    /** Runs an analysis to its end and returns its final status. */
    Map<String, Object> analyse(String source, String settings) throws IOException, InterruptedException {
        HttpResponse<String> r = send("POST", "/api/analyses", "{" + source + ", \"settings\": " + settings + "}");
        if (r.statusCode() != 202) {
            throw new AssertionError(r.statusCode() + " " + r.body());
        }
        String id = String.valueOf(map(r.body()).get("id"));
        long until = System.nanoTime() + 240_000_000_000L;
        while (System.nanoTime() < until) {
            Map<String, Object> s = map(get("/api/analyses/" + id, server.token()).body());
            if (!s.get("state").equals("queued") && !s.get("state").equals("running")) {
                return s;
            }
            Thread.sleep(100);
        }
        throw new AssertionError("analysis " + id + " did not finish in 240 s");
    }

    @SuppressWarnings("unchecked")
    Map<String, Object> map(String body) throws IOException {
        return json.readValue(body, Map.class);
    }

    @Override
    public void close() {
        server.close();
    }
}
