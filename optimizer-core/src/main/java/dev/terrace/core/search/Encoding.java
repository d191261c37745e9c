package dev.terrace.core.search;

import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;
import io.jenetics.Chromosome;
import io.jenetics.DoubleChromosome;
import io.jenetics.DoubleGene;
import io.jenetics.Genotype;

import java.util.ArrayList;
import java.util.List;

/**
 * Maps design points to Jenetics genotypes and back.
 *
 * <p>The continuous coordinates form one {@link DoubleChromosome} of d genes in [0, 1] (gene range [0, nextUp(1))). Jenetics
 * requires one gene type per genotype, so each categorical setting is one further single-gene
 * {@link DoubleChromosome} on [0, k) read as the integer level {@code floor(value)}, the same
 * information as a one-gene integer chromosome of k levels; the operators in
 * {@link GeneOperators} treat it as a level (uniform reset, swap), never as a number.
 */
final class Encoding {

    /**
     * Upper end of the continuous genes' range. Jenetics' DoubleGene ranges are half-open, so the
     * range is [0, nextUp(1)) and a coordinate of exactly 1 (the top of a box) stays representable.
     */
    static final double GENE_MAX = Math.nextUp(1.0);

    private final int dims;
    private final int[] counts;

    Encoding(DesignSpace space) {
        this.dims = space.dimensions();
        this.counts = space.levelCounts();
        for (int k : counts) {
            if (k < 1) {
                throw new IllegalArgumentException("a categorical setting has no level");
            }
        }
    }

    int dims() {
        return dims;
    }

    int categoricalCount() {
        return counts.length;
    }

    int levelCount(int j) {
        return counts[j];
    }

    /** @return true when the space has neither continuous nor categorical settings */
    boolean isEmpty() {
        return dims == 0 && counts.length == 0;
    }

    /** @return chromosome index of the continuous coordinates, or -1 when there are none */
    int continuousChromosome() {
        return dims > 0 ? 0 : -1;
    }

    /**
     * @param j a categorical setting
     * @return the index of its chromosome
     */
    int levelChromosome(int j) {
        return (dims > 0 ? 1 : 0) + j;
    }

    /** @return a genotype whose {@code newInstance()} draws uniform random individuals */
    Genotype<DoubleGene> template() {
        List<Chromosome<DoubleGene>> chs = new ArrayList<>();
        if (dims > 0) {
            chs.add(DoubleChromosome.of(0, GENE_MAX, dims));
        }
        for (int k : counts) {
            chs.add(DoubleChromosome.of(0, k, 1));
        }
        return Genotype.of(chs);
    }

    /**
     * @param p a point of this space
     * @return its genotype
     */
    Genotype<DoubleGene> encode(DesignPoint p) {
        List<Chromosome<DoubleGene>> chs = new ArrayList<>();
        if (dims > 0) {
            DoubleGene[] genes = new DoubleGene[dims];
            for (int i = 0; i < dims; i++) {
                genes[i] = DoubleGene.of(clampUnit(p.x(i)), 0, GENE_MAX);
            }
            chs.add(DoubleChromosome.of(genes));
        }
        for (int j = 0; j < counts.length; j++) {
            chs.add(DoubleChromosome.of(DoubleGene.of(p.level(j) + 0.5, 0, counts[j])));
        }
        return Genotype.of(chs);
    }

    /**
     * @param g a genotype made by this encoding or its operators
     * @return the point it stands for
     */
    DesignPoint decode(Genotype<DoubleGene> g) {
        double[] x = new double[dims];
        if (dims > 0) {
            Chromosome<DoubleGene> c = g.get(0);
            for (int i = 0; i < dims; i++) {
                x[i] = clampUnit(c.get(i).doubleValue());
            }
        }
        int[] levels = new int[counts.length];
        for (int j = 0; j < counts.length; j++) {
            levels[j] = level(g.get(levelChromosome(j)).get(0).doubleValue(), counts[j]);
        }
        return new DesignPoint(x, levels);
    }

    /**
     * @param p a point
     * @throws IllegalArgumentException when it does not belong to this space
     */
    void check(DesignPoint p) {
        if (p.dimensions() != dims || p.levelCount() != counts.length) {
            throw new IllegalArgumentException("point " + p + " does not match the space ("
                    + dims + " continuous, " + counts.length + " categorical settings)");
        }
        for (int j = 0; j < counts.length; j++) {
            if (p.level(j) < 0 || p.level(j) >= counts[j]) {
                throw new IllegalArgumentException("point " + p + " has level " + p.level(j)
                        + " for a setting with " + counts[j] + " levels");
            }
        }
    }

    /**
     * @param v a gene value on [0, k)
     * @param k the level count
     * @return the level index in [0, k)
     */
    static int level(double v, int k) {
        int l = (int) Math.floor(v);
        return Math.max(0, Math.min(k - 1, l));
    }

    /**
     * @param v a coordinate
     * @return it clamped to [0, 1]
     */
    static double clampUnit(double v) {
        return Math.max(0.0, Math.min(1.0, v));
    }

    /**
     * Reflects a perturbed coordinate back into the gene range.
     *
     * @param v a coordinate, possibly outside [0, 1]
     * @return the reflected coordinate in [0, 1]
     */
    static double reflectUnit(double v) {
        double r = v;
        if (r < 0) {
            r = -r;
        }
        if (r > 1) {
            r = 2 - r;
        }
        return clampUnit(r);
    }
}
