# statsmodels 0.13.5 (Debian python3-statsmodels), pandas 1.5.3: the blocked analysis of a CSV, for
# test/bench/blocked-against-statsmodels.mjs. Reads the CSV, fits y ~ C(treatment) + C(block) by ordinary least
# squares, and prints the type 1 analysis-of-variance table as JSON with the time the fit took inside Python.
#   /usr/bin/python3 test/bench/blocked-against-statsmodels.py FILE.csv RESPONSE TREATMENT BLOCK
import json
import sys
import time

started = time.perf_counter()
import pandas as pd  # noqa: E402
import statsmodels
from statsmodels.formula.api import ols  # noqa: E402
from statsmodels.stats.anova import anova_lm  # noqa: E402

imported = time.perf_counter()
path, response, treatment, block = sys.argv[1:5]
data = pd.read_csv(path, dtype={treatment: str, block: str})
fit = ols(f"{response} ~ C({treatment}) + C({block})", data=data).fit()
table = anova_lm(fit, typ=1)
done = time.perf_counter()
print(json.dumps({
    "statsmodels": statsmodels.__version__,
    "pandas": pd.__version__,
    "ss": {"treatment": table["sum_sq"].iloc[0], "block": table["sum_sq"].iloc[1], "error": table["sum_sq"].iloc[2]},
    "df": {"treatment": table["df"].iloc[0], "block": table["df"].iloc[1], "error": table["df"].iloc[2]},
    "import_seconds": imported - started,
    "fit_seconds": done - imported,
}))
