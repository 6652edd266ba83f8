package org.viscarta.report;

import java.util.ArrayList;
import java.util.List;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.Statements;

/**
 * The plain-language texts every report carries (PRODUCT.md "Cautions the product shows"); the
 * parts that depend on how the analysis was done are generated from its request.
 */
public final class Texts {

    private Texts() {
    }

    /** Said when the inputs call themselves demo data. */
    public static final String DEMO = "The inputs say they are invented demo data, generated from known models with noise. "
            + "They are not measurements of real materials.";

    /** The definitions, with the misfit described for the weighting that ran. */
    public static List<String[]> definitions(AnalysisRequest request) {
        List<String[]> out = new ArrayList<>(DEFINITIONS);
        out.add(new String[] {"RSS and RMS misfit", Statements.rssDefinition(request)});
        return out;
    }

    /** The definitions, with the glass transition's when temperature ramps were analysed. */
    public static List<String[]> definitions(org.viscarta.analysis.AnalysisResult r) {
        List<String[]> out = definitions(r.request());
        if (!r.transitions().isEmpty()) {
            out.addAll(GLASS_TRANSITION);
        }
        if (!r.timeTests().isEmpty()) {
            out.addAll(TIME_TESTS);
        }
        if (!r.maps().specimens().isEmpty()) {
            out.addAll(MAPS);
        }
        return out;
    }

    /** Maps in plain words: tiles, registration, regions, and why neighbouring positions are not independent. */
    static final List<String[]> MAPS = List.of(
            new String[] {"Maps",
                "A specimen measured at many positions (a grid of indentations over a cross-section or a tissue slice) is drawn "
                    + "as one coloured tile per position — E′ on a logarithmic colour scale, tan δ on a linear one, both in viridis, "
                    + "which stays readable for colour-blind readers and in greyscale. Nothing is interpolated between positions. "
                    + "Over the lab's image, the tiles are placed by the registration stated (a pixel size, or landmarks found "
                    + "both on the stage and in the image, with the residual of that fit)."},
            new String[] {"Regions and why neighbours are not independent",
                "Each position takes the region its place on the specimen falls in (a drawn polygon, or a colour of a label "
                    + "image). Regions are compared like samples (Welch t-tests with Holm's adjustment, letters; E′ on a log "
                    + "scale). But positions next to each other resemble each other — Moran's I measures how much (0: not at all, "
                    + "1: entirely; its z-score says whether that is more than chance) — so they are not independent "
                    + "measurements, and the tests, which treat them as if they were, overstate how sure a difference is. The "
                    + "letters describe this specimen; a claim about the material needs several specimens."});

    /** Stress relaxation and creep in plain words, and how they join the frequency sweeps. */
    static final List<String[]> TIME_TESTS = List.of(
            new String[] {"Stress relaxation and creep tests",
                "In a stress relaxation test the sample is deformed in one quick step and held; the force it takes to hold it "
                    + "falls with time, and divided by the step it gives the relaxation modulus E(t) (or G(t) in shear) [Pa]. In "
                    + "a creep test a constant force is applied instead, and the growing deformation gives the creep compliance "
                    + "J(t) [1/Pa]. Both hold the same information as E′ and E″ over the frequencies 1/(2πt) of the times "
                    + "measured."},
            new String[] {"Samples computed from time-domain tests",
                "A sample named with '(relaxation)' or '(creep)' was measured in time, not by oscillation. Its tests "
                    + "are fitted with every candidate model in the time domain (the closed forms of the models, Mittag-Leffler "
                    + "functions for the fractional ones), the best-supported model is fitted to each replicate alone, and each "
                    + "replicate's E′, E″ and tan δ are computed from its fitted model at the frequencies its times cover. They "
                    + "are ranked and matched beside the measured sweeps, but they rest on that model: a material the model "
                    + "does not describe well (see the residuals in its figure) is compared less well. The Data sheet holds only "
                    + "measured points; the Time-domain tests sheet holds the measured M(t) or J(t) with the model beside them."});

    /** The glass transition in plain words: why three temperatures, and which to quote. */
    static final List<String[]> GLASS_TRANSITION = List.of(
            new String[] {"Glass transition temperature Tg [°C]",
                "The glass transition is not one temperature but a range over which a film or gel goes from glassy (hard, "
                    + "stiff) to rubbery (soft): E′ falls by a factor of ten to a thousand, and E″ and tan δ pass through a "
                    + "peak. A temperature ramp shows the whole range; a Tg is one agreed point in it."},
            new String[] {"Why three Tg values",
                "ASTM E1640 (Assignment of the Glass Transition Temperature by Dynamic Mechanical Analysis; the 2018 edition "
                    + "as we recall it — check the edition you cite) names three points, and they always fall in this order: "
                    + "the onset of the E′ drop (where the stiffness starts to fall: the glassy line crossed with the steepest "
                    + "tangent, on a logarithmic scale), then the peak of E″ (where the molecular motion dissipates most energy), "
                    + "then the peak of tan δ (where damping relative to stiffness is largest), often 10 to 25 °C above the "
                    + "onset. None is more correct; they answer different questions."},
            new String[] {"Which Tg to quote",
                "Quote the convention your field, standard or earlier work uses, with the frequency and heating rate: e.g. "
                    + "'Tg (E″ peak, 1 Hz, 2 °C/min) = 45 °C'. Without one, the onset is the cautious choice for the highest "
                    + "temperature at which a film still behaves as glassy; the E″ peak is the usual figure for the transition "
                    + "itself; the tan δ peak is the one most often printed for damping. Compare samples only within one "
                    + "convention and one frequency, as the Transition ranking does. All three move to higher temperatures at "
                    + "higher frequencies and faster heating."},
            new String[] {"Apparent activation energy Ea [kJ/mol]",
                "How strongly the transition moves with frequency: from the peak temperatures at several frequencies by the "
                    + "Arrhenius law, ln f = const − Ea/(R T). Larger means a sharper dependence on rate; glass transitions of "
                    + "polymers typically give a few hundred kJ/mol (common practice). The 95 % interval comes from the scatter "
                    + "of the peak temperatures about the line."},
            new String[] {"tan δ peak height and width",
                "The height of the tan δ peak (how much the film damps at its transition) and its full width at half height "
                    + "(how broad the transition is: a broader peak means a more heterogeneous material, as ageing or "
                    + "crosslinking often makes it)."});

    /** Said when temperature ramps were analysed. */
    static final String TRANSITION_CAUTION = "A glass transition temperature holds for the frequency and heating rate of its "
            + "test; it is not a safe temperature of use or display. Apply the margins your field or local rules set.";

    static final String TIME_TEST_CAUTION = "The E′, E″ and tan δ of a sample measured by stress relaxation or creep are "
            + "computed from a fitted model, not measured: they are as good as the model's description of the test, and a "
            + "step applied over a finite ramp time distorts the earliest times (leave out the points before about ten ramp "
            + "times, common practice).";

    /** What each sheet holds, with the ranking point that ran. */
    public static List<String[]> sheets(AnalysisRequest request) {
        String at = Statements.rankedBy(request);
        List<String[]> out = new ArrayList<>();
        for (String[] s : SHEETS) {
            out.add(new String[] {s[0], s[1].replace(AT_REFERENCE, at)});
        }
        return out;
    }

    /** Stands for the ranking point in the sheet descriptions. */
    private static final String AT_REFERENCE = "tan δ at the reference frequency";

    /** The cautions, one paragraph each. */
    public static final List<String> CAUTIONS = List.of(
            "Results describe small samples under test conditions; they are not clinical or structural verdicts.",
            "Samples from works of art need the owner's and the conservator's approval before any are taken or tested.",
            "Historic paints may contain toxic pigments (lead, arsenic and mercury compounds): handle and dispose of samples "
                    + "as your local rules require.",
            "Biological tissue needs biosafety handling: follow your institution's rules and licensed practice.",
            "Hydrogels and soft tissues (kPa) lie below the modulus range of ASTM D4065 (0.5 MPa to 100 GPa); "
                    + "say so when citing that standard.");

    /** Said when a shear–tensile conversion was made. */
    static final String ISOTROPY = "Converting shear to tensile moduli (or back) with E = 2(1 + ν)G assumes an isotropic "
            + "material with a real, frequency-independent Poisson's ratio; layered films and fibrous tissues may not be.";

    /** Said whenever models were fitted. */
    static final String FIT_INTERVALS = "Fit intervals treat the points of all replicates of a sample as independent "
            + "measurements: they describe how well the model is pinned down by the pooled points, not the spread between "
            + "replicates (the damping ranking's intervals do that).";

    /** The cautions of this report: the usual ones, and those that its conversions and fits call for. */
    public static List<String> cautions(org.viscarta.analysis.AnalysisResult r) {
        List<String> out = new ArrayList<>(CAUTIONS);
        if (r.inputs().notes().stream().anyMatch(n -> n.contains("E = 2(1 + ν)G"))) {
            out.add(ISOTROPY);
        }
        if (r.request().needsFits()) {
            out.add(FIT_INTERVALS);
        }
        if (!r.transitions().isEmpty()) {
            out.add(TRANSITION_CAUTION);
        }
        if (!r.timeTests().isEmpty()) {
            out.add(TIME_TEST_CAUTION);
        }
        return out;
    }

    /** Definitions in words a non-specialist follows; each entry is a term and its explanation. */
    private static final List<String[]> DEFINITIONS = List.of(
            new String[] {"Storage modulus E′ (or G′ in shear) [Pa]",
                "How stiff the material is when wobbled at a given frequency: the part of its resistance that stores "
                    + "energy and gives it back, like a spring. Higher means stiffer."},
            new String[] {"Loss modulus E″ (or G″) [Pa]",
                "The part of the resistance that turns motion into heat, like a shock absorber. Higher means more energy "
                    + "is lost in each cycle."},
            new String[] {"Loss tangent tan δ [–]",
                "E″ divided by E′: how lossy the material is relative to how stiff it is. 0 is a perfect spring; values "
                    + "near or above 1 mean the material behaves as much like a thick liquid as like a solid. The damping "
                    + "ranking orders samples by it."},
            new String[] {"Phase angle δ [°]",
                "How far the material's response lags behind the imposed motion: 0° for a spring, 90° for a liquid. "
                    + "tan δ is the tangent of this angle."},
            new String[] {"|E*| [Pa]", "The overall stiffness, combining E′ and E″: sqrt(E′² + E″²)."},
            new String[] {"Tensile (E) and shear (G)",
                "Indentation, tension and compression give E; rotational rheometers give G. For a material that keeps its "
                    + "volume, E ≈ 3G; in general E = 2(1 + ν)G with Poisson's ratio ν. tan δ is the same on both."},
            new String[] {"Frequency [Hz]", "Oscillations per second. Angular frequency ω = 2π × frequency, in rad/s."},
            new String[] {"Model", "A small set of springs and dashpots (or power-law elements, 'springpots') whose E′ and E″ are "
                    + "fitted to the measured curves. springpot: a power law, tan δ constant. empirical-power-law: straight lines "
                    + "in log–log axes, descriptive only. springpot-dashpot: a power law plus a liquid-like term. maxwell: a "
                    + "liquid with one relaxation time. kelvin-voigt: a solid with a parallel damper. zener: a solid with one "
                    + "relaxation between two plateaus. burgers: a liquid with a delayed elastic part. generalized-maxwell: "
                    + "several relaxation times. fractional-kelvin-voigt, fractional-maxwell, fractional-zener: the same "
                    + "shapes with a power-law element, for broad relaxations as in gels, tissues and paints."},
            new String[] {"Standard error and 95 % interval",
                "How precisely the data pin down a parameter. The interval would contain the true value in about 95 % of "
                    + "repeated experiments if the model is right. A parameter flagged 'not determined by the data' is not "
                    + "pinned down by the measured frequencies and should not be quoted."},
            new String[] {"AICc and Akaike weight",
                "A score that balances how well a model fits against how many parameters it uses (lower AICc is better). "
                    + "The Akaike weight is the relative support for each model among those fitted; the weights of one sample "
                    + "add up to 1. Models within 2 AICc units of the best are about as well supported."},
            new String[] {"Letter groups", "Samples that share a letter in the damping ranking are not distinguishable from "
                    + "each other at the stated significance level: the difference in their mean tan δ could be chance, given the "
                    + "scatter between replicates. Samples with no letter in common differ."},
            new String[] {"Distance [decades]", "How far apart two materials' E′ and E″ curves are over the frequencies both were "
                    + "measured at: the typical difference on a logarithmic scale. 0 is identical; 0.1 means about 26 % apart "
                    + "on average; 1 means a factor of ten. 'Distinguishable' says whether the closest and the second closest "
                    + "differ by more than their uncertainties."},
            new String[] {"Master curve and shift factor a_T", "Many soft materials behave at a lower temperature as they do at "
                    + "a higher frequency. Shifting each temperature's curve along the frequency axis by a factor a_T joins them into "
                    + "one master curve at the reference temperature, spanning far more frequencies than one measurement. WLF and "
                    + "Arrhenius are the two usual laws for how a_T depends on temperature. If the shifted curves do not line up "
                    + "(van Gurp–Palmen plot: phase angle against |E*|), the master curve should not be trusted."});

    /** What each sheet holds. */
    private static final List<String[]> SHEETS = List.of(
            new String[] {"Summary", "One row per sample: what was measured, tan δ at the reference frequency, the best-supported model."},
            new String[] {"Damping ranking", "Samples ordered by tan δ at the reference frequency within each comparable set "
                    + "(same basis, similar temperature), highest damping first, with 95 % intervals over replicates; samples "
                    + "not ranked say why."},
            new String[] {"Group comparison", "Which differences in damping the replicates support, within each comparable set "
                    + "(same basis, similar temperature): pairwise Welch t-tests with Holm's adjustment, and, for labelled groups, "
                    + "one-way ANOVA and Kruskal–Wallis tests."},
            new String[] {"Quality", "Checks a reviewer asks for, one row per sweep and check: are E′ and E″ consistent with "
                    + "each other (Kramers–Kronig), was the sweep measured in the linear range (against the same sample's amplitude "
                    + "sweep), is one replicate off, was a film thick enough for the indentation depth, is the sweep wide, dense "
                    + "and quiet enough. Each row gives the verdict (pass, warn, fail), the value, the limit and what it means; "
                    + "the Summary and Damping ranking mark the samples concerned."},
            new String[] {"Reference matches", "For each sample, the closest reference materials of the library, with the "
                    + "distance, its uncertainty, the band compared and where the curves differ most."},
            new String[] {"Mimic ranking", "With a target sample: every other sample ranked by how closely it mimics the target."},
            new String[] {"Temperature series", "For a sample measured at several temperatures: the shift factors a_T that "
                    + "superpose its curves into one master curve at the reference temperature, WLF and Arrhenius fits to them, "
                    + "and whether superposition holds."},
            new String[] {"Transitions", "For temperature ramps: the glass transition of each ramp (sample, replicate, "
                    + "frequency) by the three ASTM E1640 conventions with standard errors, the tan δ peak's height and width, E′ "
                    + "on the glassy and rubbery plateaus, the windows each number came from, and the sample's activation energy."},
            new String[] {"Activation energy", "For each sample ramped at several frequencies: the apparent activation energy "
                    + "of its transition from the E″ and from the tan δ peaks, with 95 % intervals."},
            new String[] {"Transition ranking", "Samples compared at each frequency and convention (Tg by each convention, tan δ "
                    + "peak height): means over replicates, letters from Welch t-tests with Holm's adjustment (samples sharing a "
                    + "letter are not distinguishable), and the conclusions in words."},
            new String[] {"Positions", "For specimens measured at many positions: each position's place (m, and in the image's "
                    + "pixels when one is registered), region, E′, E″ and tan δ at the ranking frequency, and under the table how "
                    + "the positions were placed."},
            new String[] {"Regions", "Per region of a mapped specimen: the positions, E′ and tan δ medians with quartiles and "
                    + "means with 95 % intervals, letters, and under the table the comparisons and Moran's I in words."},
            new String[] {"Time-domain tests", "For stress relaxation and creep tests: every measured point (time, M(t) or "
                    + "J(t), file and line) with the best-supported model beside it and the residual, and under the table how each "
                    + "replicate's E′ and E″ were computed from its fitted model."},
            new String[] {"Model fits", "Every model fitted to every sample: parameters with units, standard errors, 95 % intervals, AICc and Akaike weights."},
            new String[] {"Derived quantities", "Quantities computed from each fit (relaxation and retardation times, crossover "
                    + "frequency, relaxed and unrelaxed moduli, viscosities), with standard errors."},
            new String[] {"Correlations", "For each sample's best-supported model: how strongly each pair of parameters moves "
                    + "together (−1 to 1); beyond ±0.99 the data cannot tell them apart (other models' flags in Model fits name "
                    + "such pairs too)."},
            new String[] {"Spectra", "For each sample, the distribution of relaxation times H(τ) its E′ and E″ support (how much "
                    + "modulus relaxes near each time; peaks are relaxation processes), over the measured window and half a decade "
                    + "beyond, with a band from the measurement noise alone (the smoothing's own bias is not in it, so it is no "
                    + "confidence interval); under the table, each sample's smoothing, equilibrium modulus, viscosity and mean "
                    + "relaxation time. Smoothing (Tikhonov regularisation, chosen by cross-validation) can merge close processes "
                    + "and does not show its own bias."},
            new String[] {"Data", "Every measured point as read, in SI units, with its file and line."},
            new String[] {"Reference library", "The reference materials available for comparison (when a library was given)."},
            new String[] {"Figures", "The figures, also written as PNG (200 dpi) and SVG files under figures/: the damping ranking, tan δ "
                    + "of every sample, the relaxation spectra, each temperature series' master curve, shift factors and van "
                    + "Gurp–Palmen plot, each sample's temperature ramps with its three Tg marked, and for each sample its fit (with residuals) and its closest references."},
            new String[] {"Provenance", "Tool version, the full command line, each input file with its SHA-256 checksum, every setting, and every warning."});
}
