package dev.terrace.core.search;

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
 * The variation operators of {@link GeneticSearch}: continuous genes are recombined by
 * extended intermediate recombination and mutated by reflected Gaussian steps; categorical genes
 * are inherited from either parent and mutated by a uniform reset to another level.
 *
 * <p>Both operators draw from {@link RandomRegistry#random()}, so a search run inside
 * {@code RandomRegistry.with(seeded, ...)} is reproducible.
 */
final class GeneOperators {

    /**
     * Extension of intermediate recombination: a child gene is a + t(b − a) with t uniform in
     * [−0.25, 1.25] (Mühlenbein &amp; Schlierkamp-Voosen, Evolutionary Computation 1(1), 1993,
     * "extended intermediate recombination", d = 0.25; from memory). Jenetics'
     * IntermediateCrossover uses the same form.
     */
    static final double RECOMBINATION_EXTENSION = 0.25;

    private GeneOperators() {
    }

    /**
     * One-child recombination: each offspring is, with the given probability, replaced by a child
     * of itself and a random mate from the same offspring pool.
     */
    static final class Recombination implements Alterer<DoubleGene, Score> {
        private final Encoding encoding;
        private final double probability;

        Recombination(Encoding encoding, double probability) {
            this.encoding = encoding;
            this.probability = probability;
        }

        @Override
        public AltererResult<DoubleGene, Score> alter(Seq<Phenotype<DoubleGene, Score>> population, long generation) {
            RandomGenerator r = RandomRegistry.random();
            int n = population.size();
            List<Phenotype<DoubleGene, Score>> out = new ArrayList<>(n);
            int altered = 0;
            for (int i = 0; i < n; i++) {
                Phenotype<DoubleGene, Score> self = population.get(i);
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
                    if (c == encoding.continuousChromosome()) {
                        chs.add(blend(a.get(c), b.get(c), r));
                    } else {
                        chs.add(r.nextBoolean() ? a.get(c) : b.get(c));
                    }
                }
                out.add(Phenotype.of(Genotype.of(chs), generation));
                altered++;
            }
            return new AltererResult<>(ISeq.of(out), altered);
        }

        private static Chromosome<DoubleGene> blend(Chromosome<DoubleGene> a, Chromosome<DoubleGene> b,
                                                    RandomGenerator r) {
            DoubleGene[] genes = new DoubleGene[a.length()];
            for (int k = 0; k < genes.length; k++) {
                double va = a.get(k).doubleValue();
                double vb = b.get(k).doubleValue();
                double t = -RECOMBINATION_EXTENSION + (1 + 2 * RECOMBINATION_EXTENSION) * r.nextDouble();
                genes[k] = a.get(k).newInstance(Encoding.reflectUnit(va + t * (vb - va)));
            }
            return DoubleChromosome.of(genes);
        }
    }

    /**
     * Per-gene mutation: a continuous gene moves by N(0, sigma²) reflected at 0 and 1; a categorical
     * gene is reset to one of the other levels, chosen uniformly.
     */
    static final class Mutation implements Alterer<DoubleGene, Score> {
        private final Encoding encoding;
        private final double probability;
        private final double sigma;
        private final double levelProbability;

        Mutation(Encoding encoding, double probability, double sigma, double levelProbability) {
            this.encoding = encoding;
            this.probability = probability;
            this.sigma = sigma;
            this.levelProbability = levelProbability;
        }

        @Override
        public AltererResult<DoubleGene, Score> alter(Seq<Phenotype<DoubleGene, Score>> population, long generation) {
            RandomGenerator r = RandomRegistry.random();
            List<Phenotype<DoubleGene, Score>> out = new ArrayList<>(population.size());
            int altered = 0;
            for (Phenotype<DoubleGene, Score> pt : population) {
                Genotype<DoubleGene> g = pt.genotype();
                List<Chromosome<DoubleGene>> chs = new ArrayList<>(g.length());
                boolean changed = false;
                for (int c = 0; c < g.length(); c++) {
                    Chromosome<DoubleGene> ch = g.get(c);
                    Chromosome<DoubleGene> m = c == encoding.continuousChromosome()
                            ? mutateContinuous(ch, r) : mutateLevel(ch, r);
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

        private Chromosome<DoubleGene> mutateContinuous(Chromosome<DoubleGene> ch, RandomGenerator r) {
            DoubleGene[] genes = null;
            for (int k = 0; k < ch.length(); k++) {
                if (r.nextDouble() < probability) {
                    if (genes == null) {
                        genes = new DoubleGene[ch.length()];
                        for (int q = 0; q < genes.length; q++) {
                            genes[q] = ch.get(q);
                        }
                    }
                    double v = ch.get(k).doubleValue() + sigma * r.nextGaussian();
                    genes[k] = ch.get(k).newInstance(Encoding.reflectUnit(v));
                }
            }
            return genes == null ? ch : DoubleChromosome.of(genes);
        }

        private Chromosome<DoubleGene> mutateLevel(Chromosome<DoubleGene> ch, RandomGenerator r) {
            DoubleGene gene = ch.get(0);
            int k = (int) Math.round(gene.max());
            if (k < 2 || r.nextDouble() >= levelProbability) {
                return ch;
            }
            int current = Encoding.level(gene.doubleValue(), k);
            int next = r.nextInt(k - 1);
            if (next >= current) {
                next++;
            }
            return DoubleChromosome.of(gene.newInstance(next + 0.5));
        }
    }
}
