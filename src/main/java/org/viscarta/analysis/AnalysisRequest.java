package org.viscarta.analysis;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import org.viscarta.compare.DampingRanking;
import org.viscarta.compare.RankingPoint;
import org.viscarta.fit.Weighting;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.sweep.ModulusKind;

/**
 * One analysis job, typed: what to read, how, and what to compute. Built by the CLI verbs (and
 * by any other surface) through {@link #builder}; {@link Analysis#run} turns it into a result.
 *
 * @param inputs       sweep-table files or folders
 * @param reading      how they are read and put on one basis
 * @param modelIds     candidate models, catalogue ids (a family may carry a fixed size, "generalized-maxwell:3")
 * @param weighting    how residuals are measured in every fit
 * @param rankingPoint where samples are ranked by damping
 * @param outsideRange what the ranking does outside a sample's measured range
 * @param alpha        significance level of the pairwise and group tests, in (0, 1)
 * @param sets         how samples are put into comparable sets for the ranking
 * @param library      the reference library's folder, when there is one
 * @param matching     how samples are compared with references and candidates
 * @param target       the material to mimic, when there is one
 * @param masterCurves how samples measured at several temperatures are superposed (empty: no master curves)
 * @param timeGrid     times [s] at which every fitted model's E(t) and J(t) are evaluated (empty: none)
 * @param parts        what to compute beyond reading
 * @param quality      how the quality checks run (and whether outlying replicates are left out)
 * @param uncertainMatches how many of each sample's closest references get the standard error of
 *                     their distance (the delta method costs a dozen distance evaluations each);
 *                     the others carry NaN. All by default; a report computes those it shows.
 */
public record AnalysisRequest(List<Path> inputs, ReadSettings reading, List<String> modelIds, Weighting weighting,
                              RankingPoint rankingPoint, DampingRanking.OutsideRange outsideRange, double alpha, ComparableSets sets,
                              Optional<Path> library, MatchSettings matching, Target target, Optional<MasterCurves> masterCurves,
                              List<Double> timeGrid, Set<Part> parts, QualitySettings quality, int uncertainMatches) {

    /** What an analysis computes beyond reading. */
    public enum Part {
        /** Every candidate model fitted to every sample. */
        FITS,
        /** The damping ranking with letter groups and group tests. */
        RANKING,
        /** Every sample against the reference library (needs a library). */
        MATCHES,
        /** The relaxation spectrum H(τ) of every sample. */
        SPECTRA,
        /** The quality checks of every sweep, replicate set and amplitude sweep. */
        QUALITY,
        /** The glass transition of every temperature ramp, activation energies and their comparison. */
        TRANSITIONS,
        /** Maps of the specimens measured at positions, with the images, registrations and regions their tables name. */
        MAPS
    }

    public AnalysisRequest {
        inputs = List.copyOf(inputs);
        modelIds = List.copyOf(modelIds);
        timeGrid = List.copyOf(timeGrid);
        for (double t : timeGrid) {
            if (!(t > 0) || Double.isInfinite(t)) {
                throw new IllegalArgumentException("times of the time domain must be finite and > 0 s, got " + t);
            }
        }
        parts = Set.copyOf(parts);
        Objects.requireNonNull(reading, "reading");
        Objects.requireNonNull(sets, "sets");
        Objects.requireNonNull(weighting, "weighting");
        Objects.requireNonNull(rankingPoint, "rankingPoint");
        Objects.requireNonNull(outsideRange, "outsideRange");
        Objects.requireNonNull(library, "library");
        Objects.requireNonNull(matching, "matching");
        Objects.requireNonNull(target, "target");
        Objects.requireNonNull(masterCurves, "masterCurves");
        Objects.requireNonNull(quality, "quality");
        if (!(alpha > 0 && alpha < 1)) {
            throw new IllegalArgumentException("the significance level must lie in (0, 1), got " + alpha);
        }
        if (modelIds.isEmpty()) {
            throw new IllegalArgumentException("at least one model is needed");
        }
        for (String id : modelIds) {
            if (ModelCatalogue.byId(id).isEmpty()) {
                throw new IllegalArgumentException("unknown model '" + id + "'; choose from " + String.join(", ", ModelCatalogue.ids()));
            }
        }
        if (parts.contains(Part.MATCHES) && library.isEmpty()) {
            throw new IllegalArgumentException("matching against references needs a reference library");
        }
    }

    /** A request for these inputs with every default: the whole catalogue, log residuals, 1 Hz, α = 0.05, reading only. */
    public static Builder builder(List<Path> inputs) {
        return new Builder(inputs);
    }

    /** True when the fits are needed: asked for, or needed by matches, a target or model values outside the range. */
    public boolean needsFits() {
        return parts.contains(Part.FITS) || parts.contains(Part.MATCHES) || !(target instanceof Target.None)
                || (parts.contains(Part.RANKING) && outsideRange == DampingRanking.OutsideRange.BEST_MODEL);
    }

    /** Builds a request; every setting has the default a user gets when not naming it. */
    public static final class Builder {
        private final List<Path> inputs;
        private Optional<ModulusKind> declaredKind = Optional.empty();
        private Optional<ModulusKind> basis = Optional.empty();
        private OptionalDouble poisson = OptionalDouble.empty();
        private Map<String, String> columns = Map.of();
        private ReadSettings.BadFiles badFiles = ReadSettings.BadFiles.LEAVE_OUT;
        private Optional<String> groupBy = Optional.empty();
        private List<String> modelIds = ModelCatalogue.ids();
        private Weighting weighting = Weighting.LOG;
        private RankingPoint rankingPoint = RankingPoint.DEFAULT;
        private DampingRanking.OutsideRange outsideRange = DampingRanking.OutsideRange.NOT_REPORTED;
        private double alpha = 0.05;
        private ComparableSets sets = ComparableSets.defaults();
        private Optional<Path> library = Optional.empty();
        private MatchSettings matching = MatchSettings.defaults();
        private Target target = Target.NONE;
        private Optional<MasterCurves> masterCurves = Optional.empty();
        private List<Double> timeGrid = List.of();
        private final Set<Part> parts = EnumSet.noneOf(Part.class);
        private QualitySettings quality = QualitySettings.defaults();
        private int uncertainMatches = Integer.MAX_VALUE;

        private Builder(List<Path> inputs) {
            this.inputs = new ArrayList<>(inputs);
        }

        /** What the moduli are when neither headers nor metadata say. */
        public Builder declaredKind(ModulusKind kind) {
            this.declaredKind = Optional.of(kind);
            return this;
        }

        /** Convert every sweep to this basis. */
        public Builder basis(ModulusKind kind) {
            this.basis = Optional.of(kind);
            return this;
        }

        /** Poisson's ratio for the conversion, overriding each file's. */
        public Builder poisson(double nu) {
            this.poisson = OptionalDouble.of(nu);
            return this;
        }

        /** Headers (as written) mapped to what they hold. */
        public Builder columns(Map<String, String> map) {
            this.columns = new LinkedHashMap<>(map);
            return this;
        }

        /** A sample attribute whose value becomes each sample's group ({@code --group-by}). */
        public Builder groupBy(String attribute) {
            this.groupBy = Optional.ofNullable(attribute);
            return this;
        }

        public Builder badFiles(ReadSettings.BadFiles b) {
            this.badFiles = b;
            return this;
        }

        public Builder models(List<String> ids) {
            this.modelIds = List.copyOf(ids);
            return this;
        }

        public Builder weighting(Weighting w) {
            this.weighting = w;
            return this;
        }

        public Builder rankingPoint(RankingPoint p) {
            this.rankingPoint = p;
            return this;
        }

        public Builder outsideRange(DampingRanking.OutsideRange o) {
            this.outsideRange = o;
            return this;
        }

        public Builder alpha(double a) {
            this.alpha = a;
            return this;
        }

        public Builder sets(ComparableSets s) {
            this.sets = s;
            return this;
        }

        public Builder library(Path folder) {
            this.library = Optional.of(folder);
            return this;
        }

        public Builder matching(MatchSettings m) {
            this.matching = m;
            return this;
        }

        /** The quality settings so far. */
        public QualitySettings qualitySettings() {
            return quality;
        }

        /** Standard errors of the distance for each sample's closest {@code n} references only (n ≥ 1). */
        public Builder uncertainMatches(int n) {
            if (n < 1) {
                throw new IllegalArgumentException("uncertainMatches must be ≥ 1, got " + n);
            }
            this.uncertainMatches = n;
            return this;
        }

        public Builder quality(QualitySettings q) {
            this.quality = q;
            return this;
        }

        public Builder target(Target t) {
            this.target = t;
            return this;
        }

        /** Build master curves of samples measured at several temperatures. */
        public Builder masterCurves(MasterCurves m) {
            this.masterCurves = Optional.of(m);
            return this;
        }

        /** Evaluate every fitted model's E(t) and J(t) at these times [s]. */
        public Builder timeGrid(double[] seconds) {
            this.timeGrid = java.util.Arrays.stream(seconds).boxed().toList();
            return this;
        }

        /** Compute these parts (reading alone is always done). */
        public Builder compute(Part... p) {
            parts.addAll(List.of(p));
            return this;
        }

        public AnalysisRequest build() {
            return new AnalysisRequest(inputs, new ReadSettings(declaredKind, basis, poisson, columns, badFiles, groupBy), modelIds, weighting,
                    rankingPoint, outsideRange, alpha, sets, library, matching, target, masterCurves, timeGrid, parts, quality, uncertainMatches);
        }
    }
}
