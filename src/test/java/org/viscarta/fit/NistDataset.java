package org.viscarta.fit;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Test-side parser of a NIST StRD nonlinear-regression file, read verbatim from the test
 * resources (CRLF line endings; data columns y then x; data from line 61; see SOURCES.md there).
 */
final class NistDataset {

    private static final Pattern PARAM = Pattern.compile("^\\s*b(\\d+)\\s*=\\s*(\\S+)\\s+(\\S+)\\s+(\\S+)\\s+(\\S+)\\s*$");
    private static final Pattern RSS = Pattern.compile("^\\s*Residual Sum of Squares:\\s*(\\S+)\\s*$");
    private static final Pattern NOBS = Pattern.compile("^\\s*Number of Observations:\\s*(\\d+)\\s*$");

    final String name;
    final double[] start1;
    final double[] start2;
    final double[] certified;
    final double[] certifiedSd;
    final double certifiedRss;
    final double[] x;
    final double[] y;

    private NistDataset(String name, double[] start1, double[] start2, double[] certified, double[] certifiedSd,
                        double certifiedRss, double[] x, double[] y) {
        this.name = name;
        this.start1 = start1;
        this.start2 = start2;
        this.certified = certified;
        this.certifiedSd = certifiedSd;
        this.certifiedRss = certifiedRss;
        this.x = x;
        this.y = y;
    }

    static NistDataset load(String name) throws IOException {
        String text;
        try (InputStream in = NistDataset.class.getResourceAsStream("/nist-strd-nls/" + name + ".dat")) {
            if (in == null) {
                throw new IOException("missing test resource nist-strd-nls/" + name + ".dat");
            }
            text = new String(in.readAllBytes(), StandardCharsets.US_ASCII);
        }
        String[] lines = text.split("\r?\n", -1);
        List<double[]> params = new ArrayList<>();
        double rss = Double.NaN;
        int nobs = -1;
        for (int i = 0; i < 60 && i < lines.length; i++) {
            Matcher m = PARAM.matcher(lines[i]);
            if (m.matches()) {
                params.add(new double[] {Double.parseDouble(m.group(2)), Double.parseDouble(m.group(3)),
                        Double.parseDouble(m.group(4)), Double.parseDouble(m.group(5))});
            }
            Matcher r = RSS.matcher(lines[i]);
            if (r.matches()) {
                rss = Double.parseDouble(r.group(1));
            }
            Matcher o = NOBS.matcher(lines[i]);
            if (o.matches()) {
                nobs = Integer.parseInt(o.group(1));
            }
        }
        if (params.isEmpty() || Double.isNaN(rss) || nobs < 1) {
            throw new IOException(name + ": header not understood");
        }
        int p = params.size();
        double[] s1 = new double[p];
        double[] s2 = new double[p];
        double[] cert = new double[p];
        double[] sd = new double[p];
        for (int j = 0; j < p; j++) {
            s1[j] = params.get(j)[0];
            s2[j] = params.get(j)[1];
            cert[j] = params.get(j)[2];
            sd[j] = params.get(j)[3];
        }
        double[] x = new double[nobs];
        double[] y = new double[nobs];
        for (int i = 0; i < nobs; i++) {
            String[] f = lines[60 + i].trim().split("\\s+");
            y[i] = Double.parseDouble(f[0]);
            x[i] = Double.parseDouble(f[1]);
        }
        return new NistDataset(name, s1, s2, cert, sd, rss, x, y);
    }
}
