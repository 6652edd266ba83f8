package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.Reader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.model.ViscoelasticModel;

/**
 * {@code fit} and {@code rank} on relaxation and creep tables: the files are read as time-domain
 * tests, fitted with the catalogue's time-domain forms, and the samples they give carry their origin.
 */
@Tag("self-check")
class TimeDomainCommandTest {

    @TempDir
    Path dir;

    @Test
    void fitReadsAndFitsRelaxationAndCreepTables() throws IOException {
        // noise-free data from known zener materials, in units a lab writes (kPa, ms, 1/MPa)
        ViscoelasticModel z = ModelCatalogue.byId("zener").orElseThrow();
        double[] gel = {20e3, 10e3, 0.5};
        double[] film = {2e6, 1e6, 3.0};
        StringBuilder relax = new StringBuilder("# sample: gel\n# modulus: tensile\ntime [s],E(t) [kPa]\n");
        StringBuilder creep = new StringBuilder("sample,replicate,time [ms],J(t) [1/MPa]\n");
        for (int i = 0; i < 25; i++) {
            double t = 0.01 * Math.pow(1e4, i / 24.0);
            relax.append(String.format(Locale.ROOT, "%.8g,%.10g%n", t, z.relaxationModulus(t, gel) / 1e3));
            creep.append(String.format(Locale.ROOT, "film,1,%.8g,%.10g%n", t * 1e3, z.creepCompliance(t, film) * 1e6));
        }
        Files.writeString(dir.resolve("gel-relaxation.csv"), relax.toString());
        Files.writeString(dir.resolve("film-creep.csv"), "# modulus: tensile\n" + creep);
        Path out = dir.resolve("fits.csv");
        CliRun r = CliRun.of("fit", dir.resolve("gel-relaxation.csv").toString(), dir.resolve("film-creep.csv").toString(),
                "--models", "zener,maxwell", "-o", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("gel (relaxation)") && r.out().contains("film (creep)"), r.out());
        assertTrue(r.err().contains("2 time-domain test(s) read (1 stress relaxation, 1 creep)"), r.err());
        List<CSVRecord> rows;
        try (Reader in = Files.newBufferedReader(out);
             CSVParser p = CSVParser.parse(in, CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get())) {
            rows = p.getRecords();
        }
        for (Object[] c : new Object[][] {{"gel (relaxation)", gel}, {"film (creep)", film}}) {
            double[] truth = (double[]) c[1];
            String[] names = {"E_r", "E_1", "tau"};
            for (int j = 0; j < 3; j++) {
                String name = names[j];
                CSVRecord row = rows.stream().filter(x -> x.get("sample").equals(c[0]) && x.get("model").equals("zener")
                        && x.get("parameter").equals(name)).findFirst().orElseThrow();
                assertEquals(truth[j], Double.parseDouble(row.get("value")), 1e-6 * truth[j], c[0] + " " + name);
                assertEquals("true", row.get("best"), c[0] + ": the zener is best supported on zener data");
            }
        }
    }

    @Test
    void aRelaxationTestIsRankedBesideSweepsUnderItsOrigin() {
        CliRun r = CliRun.of("rank", "demo-data/hydrogel-screen", "--basis", "tensile");
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("gelatin-5pct") && r.out().contains("(relaxation)"), r.out());
        r.out().lines().forEach(l -> assertTrue(l.codePointCount(0, l.length()) <= 100, "within 100 columns: " + l));
    }
}
