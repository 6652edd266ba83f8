package org.viscarta.serve;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;
import java.util.zip.ZipEntry;
import java.util.zip.ZipInputStream;

import org.apache.poi.ss.usermodel.DataFormatter;
import org.apache.poi.ss.usermodel.Row;
import org.apache.poi.ss.usermodel.Sheet;
import org.apache.poi.xssf.usermodel.XSSFWorkbook;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.cli.Viscarta;

/**
 * The workbench's HTTP API on a real server on a free local port: the token, folders and names
 * that try to leave where they may be, size limits, malformed requests, several analyses at once,
 * failures that leave the server up, and the library shared with the command line.
 */
@Tag("regression")
class WorkbenchApiTest {

    @TempDir
    static Path scratch;

    static WorkbenchFixture wb;
    static Path data;

    private static final String FAST = "{\"models\": [\"zener\"], \"use_library\": false}";

    @BeforeAll
    static void start() throws IOException {
        data = scratch.resolve("data");
        Files.createDirectories(data.resolve("gels"));
        Files.copy(Path.of("demo-data/hydrogel-screen/agarose-1.0pct-r1.csv"), data.resolve("gels/agarose-1.0pct-r1.csv"));
        Files.createDirectories(scratch.resolve("secret"));
        Files.writeString(scratch.resolve("secret/private.csv"), "frequency [Hz],E' [Pa],E'' [Pa]\n1,2,3\n");
        Files.createSymbolicLink(data.resolve("escape"), scratch.resolve("secret"));
        wb = new WorkbenchFixture(scratch.resolve("a"), data, 50L << 20);
    }

    @AfterAll
    static void stop() {
        wb.close();
    }

    @Test
    void everyRequestNeedsTheToken() throws Exception {
        for (String path : List.of("/", "/assets/app.js", "/assets/uplot.js", "/api/about", "/api/library", "/api/analyses/a1",
                "/api/data?path=gels")) {
            assertEquals(401, wb.get(path, null).statusCode(), path + " without a token");
            assertEquals(403, wb.get(path, "not-the-token").statusCode(), path + " with a wrong token");
        }
        HttpResponse<String> page = wb.get("/?token=" + wb.server.token(), null);
        assertEquals(302, page.statusCode(), "the token leaves the address bar");
        String cookie = page.headers().firstValue("Set-Cookie").orElseThrow();
        assertTrue(cookie.contains("HttpOnly") && cookie.contains("SameSite=Strict"), cookie);
        HttpResponse<String> withCookie = wb.http.send(java.net.http.HttpRequest.newBuilder(java.net.URI.create(wb.base() + "/"))
                .header("Cookie", cookie.split(";")[0]).GET().build(), HttpResponse.BodyHandlers.ofString());
        assertEquals(200, withCookie.statusCode());
        assertTrue(withCookie.body().contains("Viscarta workbench"));
        String csp = withCookie.headers().firstValue("Content-Security-Policy").orElseThrow();
        assertTrue(csp.contains("default-src 'none'") && csp.contains("script-src 'self'") && !csp.contains("unsafe"), csp);
        assertFalse(withCookie.body().contains("http://") || withCookie.body().contains("https://"),
                "the page loads nothing from elsewhere");
        HttpResponse<String> js = wb.get("/assets/app.js", wb.server.token());
        assertEquals(200, js.statusCode());
        assertFalse(js.body().contains("http://") || js.body().contains("https://"), "the script fetches nothing from elsewhere");
        assertEquals(200, wb.get("/assets/uplot.js", wb.server.token()).statusCode(), "the charting library comes from the jar");
    }

    @Test
    void foldersOutsideTheDataFolderAreRefused() throws Exception {
        assertEquals(200, wb.get("/api/data?path=gels", wb.server.token()).statusCode());
        for (String p : List.of("..", "../secret", "gels/../..", "escape", "escape/private.csv")) {
            HttpResponse<String> r = wb.get("/api/data?path=" + java.net.URLEncoder.encode(p, StandardCharsets.UTF_8), wb.server.token());
            assertEquals(403, r.statusCode(), p + ": " + r.body());
            HttpResponse<String> i = wb.send("POST", "/api/inspect", "{\"data\": \"" + p + "\"}");
            assertEquals(403, i.statusCode(), p + ": " + i.body());
            HttpResponse<String> a = wb.send("POST", "/api/analyses", "{\"data\": \"" + p + "\", \"settings\": " + FAST + "}");
            assertEquals(403, a.statusCode(), p + ": " + a.body());
        }
        HttpResponse<String> ok = wb.send("POST", "/api/inspect", "{\"data\": \"gels\"}");
        assertEquals(200, ok.statusCode(), ok.body());
        assertTrue(ok.body().contains("agarose-1.0pct-r1.csv") && !ok.body().contains(scratch.toString()),
                "names are relative to the data folder, never the server's paths: " + ok.body());
    }

    @Test
    void uploadNamesCannotLeaveTheUpload() throws Exception {
        Set<Path> before = tree(wb.server.work());
        for (String name : List.of("../evil.csv", "/abs.csv", "a/../../evil.csv", "C:\\evil.csv", "..\\evil.csv", "./x/../../evil.csv")) {
            HttpResponse<String> r = wb.upload("/api/uploads", Map.of(name, "frequency [Hz],E' [Pa],E'' [Pa]\n1,2,3\n"
                    .getBytes(StandardCharsets.UTF_8)), Map.of());
            assertEquals(400, r.statusCode(), name + ": " + r.body());
        }
        Set<Path> after = tree(wb.server.work());
        after.removeAll(before);
        assertTrue(after.stream().noneMatch(p -> p.getFileName().toString().contains("evil")), after.toString());
        assertFalse(Files.exists(wb.server.work().getParent().resolve("evil.csv")), "nothing was written beside the private folder");
        HttpResponse<String> nested = wb.upload("/api/uploads", Map.of("gels/sub/a.csv", Files.readAllBytes(
                Path.of("demo-data/hydrogel-screen/agarose-1.0pct-r1.csv"))), Map.of());
        assertEquals(201, nested.statusCode(), nested.body());
        assertTrue(nested.body().contains("gels/sub/a.csv"), "a folder's structure is kept: " + nested.body());
    }

    @Test
    void oversizedUploadsAreRefusedAndLeaveNothing(@TempDir Path other) throws Exception {
        try (WorkbenchFixture small = new WorkbenchFixture(other, null, 4096)) {
            HttpResponse<String> r = small.upload("/api/uploads", Map.of("big.csv", new byte[20_000]), Map.of());
            assertEquals(413, r.statusCode(), r.body());
            assertTrue(r.body().contains("--max-upload"), r.body());
            try (Stream<Path> s = Files.list(small.server.work())) {
                assertTrue(s.noneMatch(p -> p.getFileName().toString().startsWith("upload-")), "no upload folder was made");
            }
            HttpResponse<String> noData = small.get("/api/data?path=", small.server.token());
            assertEquals(403, noData.statusCode(), "without --data no server folder is readable");
            assertEquals(200, small.get("/api/about", small.server.token()).statusCode(), "the server is still up");
        }
    }

    @Test
    void malformedRequestsGetAClear400() throws Exception {
        String upload = wb.uploadFiles(List.of("demo-data/hydrogel-screen/agarose-1.0pct-r1.csv"));
        Map<String, Integer> cases = new LinkedHashMap<>();
        cases.put("{not json", 400);
        cases.put("[1, 2]", 400);
        cases.put("{}", 400);
        cases.put("{\"upload\": \"" + upload + "\", \"data\": \"gels\"}", 400);
        cases.put("{\"upload\": \"" + upload + "\", \"settings\": {\"alpha\": \"abc\"}}", 400);
        cases.put("{\"upload\": \"" + upload + "\", \"settings\": {\"at\": \"-3 Hz\"}}", 400);
        cases.put("{\"upload\": \"" + upload + "\", \"settings\": {\"basis\": \"sideways\"}}", 400);
        cases.put("{\"upload\": \"" + upload + "\", \"settings\": {\"models\": [\"no-such-model\"]}}", 400);
        cases.put("{\"upload\": \"" + upload + "\", \"settings\": 7}", 400);
        cases.put("{\"upload\": \"u999999\"}", 404);
        for (Map.Entry<String, Integer> c : cases.entrySet()) {
            HttpResponse<String> r = wb.send("POST", "/api/analyses", c.getKey());
            assertEquals(c.getValue(), r.statusCode(), c.getKey() + " → " + r.body());
            assertNotNull(wb.map(r.body()).get("error"), r.body());
            assertFalse(r.body().contains("\n"), "one line: " + r.body());
        }
        assertEquals(404, wb.get("/api/analyses/a999999", wb.server.token()).statusCode());
        assertEquals(404, wb.get("/api/analyses/a999999/files/report.xlsx", wb.server.token()).statusCode());
        assertEquals(400, wb.send("POST", "/api/uploads", "{}").statusCode(), "an upload must be multipart");
        assertEquals(404, wb.get("/no/such/page", wb.server.token()).statusCode());
    }

    @Test
    void aBadFileGetsTheCommandLinesMessageBesideIt(@TempDir Path dir) throws Exception {
        String bad = "# sample: broken\nfrequency [Hz],storage_modulus [kPa],loss_modulus [kPa]\n0.1,12,1\n1,abc,2\n";
        Path file = dir.resolve("broken.csv");
        Files.writeString(file, bad);
        StringWriter err = new StringWriter();
        int code = Viscarta.execute(new String[] {"inspect", file.toString()}, new PrintWriter(new StringWriter()), new PrintWriter(err));
        assertEquals(2, code);
        String cli = err.toString().strip();
        cli = cli.substring(cli.indexOf(file.toString())).replace(dir.toString() + java.io.File.separator, "");
        Map<String, byte[]> files = new LinkedHashMap<>();
        files.put("broken.csv", bad.getBytes(StandardCharsets.UTF_8));
        files.put("agarose-1.0pct-r1.csv", Files.readAllBytes(Path.of("demo-data/hydrogel-screen/agarose-1.0pct-r1.csv")));
        String id = String.valueOf(wb.map(wb.upload("/api/uploads", files, Map.of()).body()).get("upload"));
        Map<String, Object> inspected = wb.map(wb.send("POST", "/api/inspect", "{\"upload\": \"" + id + "\"}").body());
        @SuppressWarnings("unchecked")
        List<Map<String, Object>> leftOut = (List<Map<String, Object>>) inspected.get("left_out");
        assertEquals(1, leftOut.size(), inspected.toString());
        assertEquals("broken.csv", leftOut.get(0).get("file"));
        assertEquals(cli, leftOut.get(0).get("message"), "the same one-line message as the command line");
        @SuppressWarnings("unchecked")
        List<Object> read = (List<Object>) inspected.get("files");
        assertEquals(1, read.size());
    }

    @Test
    void severalAnalysesAtOnceDoNotInterfereAndAFailureLeavesTheServerUp() throws Exception {
        List<List<String>> sets = List.of(
                List.of("demo-data/hydrogel-screen/agarose-1.0pct-r1.csv", "demo-data/hydrogel-screen/agarose-1.0pct-r2.csv",
                        "demo-data/hydrogel-screen/gelatin-5pct-r1.csv", "demo-data/hydrogel-screen/gelatin-5pct-r2.csv"),
                List.of("demo-data/hydrogel-screen/agarose-2.0pct-r1.csv", "demo-data/hydrogel-screen/agarose-2.0pct-r2.csv",
                        "demo-data/hydrogel-screen/polyacrylamide-8pct-r1.csv", "demo-data/hydrogel-screen/polyacrylamide-8pct-r2.csv"),
                List.of("demo-data/hydrogel-screen/gelatin-10pct-r1.csv", "demo-data/hydrogel-screen/gelatin-10pct-r2.csv",
                        "demo-data/hydrogel-screen/gelatin-10pct-r3.csv"));
        List<String> uploads = new ArrayList<>();
        for (List<String> s : sets) {
            uploads.add(wb.uploadFiles(s));
        }
        Path badFile = scratch.resolve("only-bad.csv");
        Files.writeString(badFile, "frequency [Hz],storage_modulus [kPa],loss_modulus [kPa]\n1,abc,2\n");
        String badUpload = wb.uploadFiles(List.of(badFile.toString()));
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try {
            List<Future<Map<String, Object>>> runs = new ArrayList<>();
            for (String u : uploads) {
                runs.add(pool.submit(() -> wb.analyse("\"upload\": \"" + u + "\"", FAST)));
            }
            Future<Map<String, Object>> failing = pool.submit(() -> wb.analyse("\"upload\": \"" + badUpload + "\"", FAST));
            Map<String, Object> failed = failing.get();
            assertEquals("failed", failed.get("state"), failed.toString());
            assertTrue(String.valueOf(failed.get("error")).contains("only-bad.csv:2:2"), failed.toString());
            assertFalse(String.valueOf(failed.get("error")).contains(wb.server.work().toString()), "no server path in the message");
            for (int i = 0; i < sets.size(); i++) {
                Map<String, Object> s = runs.get(i).get();
                assertEquals("done", s.get("state"), s.toString());
                Map<String, Object> result = wb.map(wb.get("/api/analyses/" + s.get("id") + "/result", wb.server.token()).body());
                Set<String> names = new HashSet<>();
                @SuppressWarnings("unchecked")
                List<Map<String, Object>> samples = (List<Map<String, Object>>) result.get("samples");
                samples.forEach(x -> names.add(String.valueOf(x.get("name"))));
                Set<String> expected = new HashSet<>();
                for (String f : sets.get(i)) {
                    String n = Path.of(f).getFileName().toString();
                    expected.add(n.substring(0, n.lastIndexOf("-r")));
                }
                assertEquals(expected, names, "each analysis holds its own samples only");
            }
        } finally {
            pool.shutdownNow();
        }
        assertEquals(200, wb.get("/api/about", wb.server.token()).statusCode(), "the server stays up after a failed analysis");
    }

    @Test
    void thePageShowsTheWorkbooksRankingAndTheDownloadsAreComplete() throws Exception {
        String u = wb.uploadFiles(List.of("demo-data/hydrogel-screen/agarose-1.0pct-r1.csv", "demo-data/hydrogel-screen/agarose-1.0pct-r2.csv",
                "demo-data/hydrogel-screen/agarose-1.0pct-r3.csv", "demo-data/hydrogel-screen/gelatin-5pct-r1.csv",
                "demo-data/hydrogel-screen/gelatin-5pct-r2.csv", "demo-data/hydrogel-screen/gelatin-5pct-r3.csv"));
        Map<String, Object> s = wb.analyse("\"upload\": \"" + u + "\"", "{\"models\": [\"zener\", \"springpot\"], \"at\": \"1 Hz\"}");
        assertEquals("done", s.get("state"), s.toString());
        String id = String.valueOf(s.get("id"));
        Map<String, Object> result = wb.map(wb.get("/api/analyses/" + id + "/result", wb.server.token()).body());
        @SuppressWarnings("unchecked")
        Map<String, Object> ranking = ((List<Map<String, Object>>) result.get("tables")).stream()
                .filter(t -> "ranking".equals(t.get("id"))).findFirst().orElseThrow();
        @SuppressWarnings("unchecked")
        List<String> headers = (List<String>) ranking.get("headers");
        @SuppressWarnings("unchecked")
        List<List<String>> rows = (List<List<String>>) ranking.get("rows");
        HttpResponse<byte[]> xlsx = wb.getBytes("/api/analyses/" + id + "/files/report.xlsx");
        assertEquals(200, xlsx.statusCode());
        try (XSSFWorkbook book = new XSSFWorkbook(new ByteArrayInputStream(xlsx.body()))) {
            Sheet sheet = book.getSheet("Damping ranking");
            assertNotNull(sheet);
            DataFormatter f = new DataFormatter(java.util.Locale.ROOT);
            int headerRow = -1;
            for (Row r : sheet) {
                if (r.getCell(0) != null && f.formatCellValue(r.getCell(0)).equals(headers.get(0))) {
                    headerRow = r.getRowNum();
                    break;
                }
            }
            assertTrue(headerRow >= 0, "the sheet has the page's header " + headers.get(0));
            int sampleCol = headers.indexOf("sample");
            for (int i = 0; i < rows.size(); i++) {
                Row r = sheet.getRow(headerRow + 1 + i);
                assertEquals(rows.get(i).get(sampleCol), f.formatCellValue(r.getCell(sampleCol)), "row " + i + ": same order, same names");
                assertEquals(headers.get(sampleCol), f.formatCellValue(sheet.getRow(headerRow).getCell(sampleCol)));
            }
        }
        Set<String> entries = new HashSet<>();
        try (ZipInputStream z = new ZipInputStream(new ByteArrayInputStream(wb.getBytes("/api/analyses/" + id + "/files/all.zip").body()))) {
            for (ZipEntry e = z.getNextEntry(); e != null; e = z.getNextEntry()) {
                entries.add(e.getName());
            }
        }
        assertTrue(entries.contains("report.xlsx") && entries.contains("report.html") && entries.contains("figures/damping-ranking.png"),
                entries.toString());
        assertEquals(200, wb.getBytes("/api/analyses/" + id + "/figures/damping-ranking.svg").statusCode());
        assertEquals(400, wb.getBytes("/api/analyses/" + id + "/figures/..%2Freport.xlsx").statusCode());
        HttpResponse<byte[]> html = wb.getBytes("/api/analyses/" + id + "/files/report.html");
        assertTrue(new String(html.body(), StandardCharsets.UTF_8).contains("Damping ranking"));
    }

    @Test
    void theLibraryIsSharedWithTheCommandLineAndValidatedAlike() throws Exception {
        int before = references();
        Map<String, String> fields = Map.of("name", "test-agarose", "class", "gel", "condition", "as cast");
        HttpResponse<String> added = wb.upload("/api/library", Map.of("agarose.csv",
                Files.readAllBytes(Path.of("demo-data/hydrogel-screen/agarose-1.0pct-r1.csv"))), fields);
        assertEquals(201, added.statusCode(), added.body());
        assertEquals(before + 1, references());
        StringWriter out = new StringWriter();
        assertEquals(0, Viscarta.execute(new String[] {"library", "list", "--library", wb.library.toString()}, new PrintWriter(out),
                new PrintWriter(new StringWriter())));
        assertTrue(out.toString().contains("test-agarose"), "the command line sees what the page added");
        HttpResponse<String> shown = wb.get("/api/library/test-agarose", wb.server.token());
        assertEquals(200, shown.statusCode());
        assertTrue(shown.body().contains("\"frequency_hz\""));
        HttpResponse<String> again = wb.upload("/api/library", Map.of("agarose.csv",
                Files.readAllBytes(Path.of("demo-data/hydrogel-screen/agarose-1.0pct-r1.csv"))), fields);
        assertEquals(400, again.statusCode(), "a duplicate name is refused as on the command line: " + again.body());
        HttpResponse<String> bad = wb.upload("/api/library", Map.of("bad.csv", "frequency [Hz],E' [Pa]\n1,abc\n"
                .getBytes(StandardCharsets.UTF_8)), Map.of("name", "bad", "class", "gel"));
        assertEquals(400, bad.statusCode(), bad.body());
        assertEquals(before + 1, references(), "a bad file changes nothing");
        HttpResponse<String> removed = wb.send("DELETE", "/api/library/test-agarose", null);
        assertEquals(200, removed.statusCode(), removed.body());
        assertEquals(before, references());
        try (Stream<Path> s = Files.list(wb.library.resolve(".removed"))) {
            assertTrue(s.anyMatch(p -> p.getFileName().toString().contains("test-agarose")), "the removed file is kept");
        }
        assertEquals(404, wb.send("DELETE", "/api/library/no-such-reference", null).statusCode());
    }

    @Test
    void closingTheServerDeletesItsUploads(@TempDir Path other) throws Exception {
        WorkbenchFixture temp = new WorkbenchFixture(other, null, 1 << 20);
        temp.uploadFiles(List.of("demo-data/hydrogel-screen/agarose-1.0pct-r1.csv"));
        Path work = temp.server.work();
        assertTrue(Files.isDirectory(work));
        temp.close();
        assertFalse(Files.exists(work), "the private folder is gone");
    }

    private static int references() throws IOException {
        try (Stream<Path> s = Files.list(wb.library)) {
            return (int) s.filter(Files::isRegularFile).filter(p -> !p.getFileName().toString().startsWith(".")).count();
        }
    }

    private static Set<Path> tree(Path root) throws IOException {
        try (Stream<Path> s = Files.walk(root)) {
            return new HashSet<>(s.toList());
        }
    }
}
