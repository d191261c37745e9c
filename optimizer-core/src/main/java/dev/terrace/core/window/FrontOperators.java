package dev.terrace.core.window;

import io.jenetics.Alterer;
import io.jenetics.AltererResult;
import io.jenetics.Chromosome;
import io.jenetics.DoubleChromosome;
import io.jenetics.DoubleGene;
import io.jenetics.Genotype;
import io.jenetics.Phenotype;
import io.jenetics.util.ISeq;
import io.jenetics.util.RandomRegistry;
import io.jenetics.util.Seq;

import java.util.ArrayList;
import java.util.List;
import java.util.random.RandomGenerator;

/**
 * Variation operators of the yield/cost front search, on the same genotype layout as the
 * proposer's search ({@code dev.terrace.core.search}): chromosome 0 holds the continuous
 * coordinates in [0, 1], each further one-gene chromosome on [0, k) a categorical level
 * {@code floor(value)}. Continuous genes are recombined along the line through both parents and
 * mutated by reflected Gaussian steps; levels are inherited from either parent and reset to
 * another level at random. All randomness comes from {@link RandomRegistry#random()}.
 */
final class FrontOperators {

    /**
     * Line recombination extension: a child is a + t(b − a) with one t uniform in [−0.25, 1.25]
     * for all genes (Mühlenbein &amp; Schlierkamp-Voosen, Evolutionary Computation 1(1), 1993, line
     * recombination with d = 0.25; from memory). Jenetics' LineCrossover has the same form.
     */
    static final double LINE_EXTENSION = 0.25;

    private FrontOperators() {
    }

    /** @return the upper end of a continuous gene's range (half-open ranges keep 1 representable) */
    static double geneMax() {
        return Math.nextUp(1.0);
    }

    /**
     * Reflects a coordinate back into [0, 1].
     *
     * @param v a coordinate
     * @return the reflected coordinate
     */
    static double reflect(double v) {
        double r = v < 0 ? -v : v;
        if (r > 1) {
            r = 2 - r;
        }
        return Math.max(0.0, Math.min(1.0, r));
    }

    /** Line recombination of continuous genes; uniform inheritance of levels. */
    static final class Recombination<C extends Comparable<? super C>> implements Alterer<DoubleGene, C> {
        private final boolean hasContinuous;
        private final double probability;

        Recombination(boolean hasContinuous, double probability) {
            this.hasContinuous = hasContinuous;
            this.probability = probability;
        }

        @Override
        public AltererResult<DoubleGene, C> alter(Seq<Phenotype<DoubleGene, C>> population, long generation) {
            RandomGenerator r = RandomRegistry.random();
            int n = population.size();
            List<Phenotype<DoubleGene, C>> out = new ArrayList<>(n);
            int altered = 0;
            for (int i = 0; i < n; i++) {
                Phenotype<DoubleGene, C> self = population.get(i);
                if (n < 2 || r.nextDouble() >= probability) {
                    out.add(self);
                    continue;
                }
                int j = r.nextInt(n - 1);
                if (j >= i) {
                    j++;
                }
                Genotype<DoubleGene> a = self.genotype();
                Genotype<DoubleGene> b = population.get(j).genotype();
                List<Chromosome<DoubleGene>> chs = new ArrayList<>(a.length());
                for (int c = 0; c < a.length(); c++) {
                    if (c == 0 && hasContinuous) {
                        double t = -LINE_EXTENSION + (1 + 2 * LINE_EXTENSION) * r.nextDouble();
                        Chromosome<DoubleGene> ca = a.get(c);
                        Chromosome<DoubleGene> cb = b.get(c);
                        DoubleGene[] genes = new DoubleGene[ca.length()];
                        for (int k = 0; k < genes.length; k++) {
                            double va = ca.get(k).doubleValue();
                            double vb = cb.get(k).doubleValue();
                            genes[k] = ca.get(k).newInstance(reflect(va + t * (vb - va)));
                        }
                        chs.add(DoubleChromosome.of(genes));
                    } else {
                        chs.add(r.nextBoolean() ? a.get(c) : b.get(c));
                    }
                }
                out.add(Phenotype.of(Genotype.of(chs), generation));
                altered++;
            }
            return new AltererResult<>(ISeq.of(out), altered);
        }
    }

    /** Reflected Gaussian mutation of continuous genes; uniform reset of levels. */
    static final class Mutation<C extends Comparable<? super C>> implements Alterer<DoubleGene, C> {
        private final boolean hasContinuous;
        private final double geneProbability;
        private final double sigma;
        private final double levelProbability;

        Mutation(boolean hasContinuous, double geneProbability, double sigma, double levelProbability) {
            this.hasContinuous = hasContinuous;
            this.geneProbability = geneProbability;
            this.sigma = sigma;
            this.levelProbability = levelProbability;
        }

        @Override
        public AltererResult<DoubleGene, C> alter(Seq<Phenotype<DoubleGene, C>> population, long generation) {
            RandomGenerator r = RandomRegistry.random();
            List<Phenotype<DoubleGene, C>> out = new ArrayList<>(population.size());
            int altered = 0;
            for (Phenotype<DoubleGene, C> pt : population) {
                Genotype<DoubleGene> g = pt.genotype();
                List<Chromosome<DoubleGene>> chs = new ArrayList<>(g.length());
                boolean changed = false;
                for (int c = 0; c < g.length(); c++) {
                    Chromosome<DoubleGene> ch = g.get(c);
                    Chromosome<DoubleGene> m = c == 0 && hasContinuous ? continuous(ch, r) : level(ch, r);
                    changed |= m != ch;
                    chs.add(m);
                }
                if (changed) {
                    out.add(Phenotype.of(Genotype.of(chs), generation));
                    altered++;
                } else {
                    out.add(pt);
                }
            }
            return new AltererResult<>(ISeq.of(out), altered);
        }

        private Chromosome<DoubleGene> continuous(Chromosome<DoubleGene> ch, RandomGenerator r) {
            DoubleGene[] genes = null;
            for (int k = 0; k < ch.length(); k++) {
                if (r.nextDouble() < geneProbability) {
                    if (genes == null) {
                        genes = new DoubleGene[ch.length()];
                        for (int q = 0; q < genes.length; q++) {
                            genes[q] = ch.get(q);
                        }
                    }
                    genes[k] = ch.get(k).newInstance(reflect(ch.get(k).doubleValue() + sigma * r.nextGaussian()));
                }
            }
            return genes == null ? ch : DoubleChromosome.of(genes);
        }

        private Chromosome<DoubleGene> level(Chromosome<DoubleGene> ch, RandomGenerator r) {
            DoubleGene gene = ch.get(0);
            int k = (int) Math.round(gene.max());
            if (k < 2 || r.nextDouble() >= levelProbability) {
                return ch;
            }
            int current = Math.max(0, Math.min(k - 1, (int) Math.floor(gene.doubleValue())));
            int next = r.nextInt(k - 1);
            if (next >= current) {
                next++;
            }
            return DoubleChromosome.of(gene.newInstance(next + 0.5));
        }
    }
}
