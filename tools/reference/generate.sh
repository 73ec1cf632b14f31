#!/usr/bin/env bash
# Regenerates testdata/reference/ from R's stats and scipy where they are
# installed (Debian: r-base-core, python3-scipy). Go tests read the committed
# files, so `make test` needs neither.
set -euo pipefail
cd "$(dirname "$0")/../.."
out=testdata/reference
mkdir -p "$out"
Rscript tools/reference/datasets.R "$out"
/usr/bin/python3 tools/reference/scipy_kruskal.py "$out"

/usr/bin/python3 tools/reference/chi2_tail.py "$out/chi2_tail.tsv"
/usr/bin/python3 tools/reference/clopper_pearson.py "$out/clopper_pearson.tsv"
/usr/bin/python3 tools/reference/exact_reference.py "$out"
Rscript tools/reference/srange.R "$out/srange_r.tsv"
/usr/bin/python3 tools/reference/srange_tail.py "$out/srange_tail.tsv"
Rscript tools/reference/padjust.R "$out/padjust.tsv"
/usr/bin/python3 tools/reference/posthoc.py "$out"
Rscript tools/reference/wilcox.R "$out"
/usr/bin/python3 tools/reference/epsilon_bootstrap.py "$out/epsilon_bootstrap.tsv"
Rscript tools/reference/battery.R testdata/battery
Rscript tools/reference/trend.R testdata/trend
/usr/bin/python3 tools/reference/trend_exact.py testdata/trend
Rscript tools/reference/reference_group.R testdata/reference_group
Rscript tools/reference/protect.R testdata/protect
echo "wrote $out"
