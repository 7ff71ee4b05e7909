#!/usr/bin/env python3
"""Makes the hourly CSV series of the Vennick Valley demo region (networks/demo-region.json).

Run from anywhere:  python3 networks/demo-region/make-series.py
It rewrites, next to this script:
  influent.csv      influent forecast per plant, m3/h            columns: dunmarrow, ambrook, tessford, whinlow
  biogas.csv        digester gas forecast per plant, Nm3/h       columns: dunmarrow, ambrook, tessford
  demand.csv        hourly customer demand forecast, m3/h        column:  tarnfield-cooling
  market-price.csv  hourly energy price of the market tariff     column:  pricePerMWh (EUR/MWh)
  availability.csv  units available per stage                    column:  tessford-filter-uv

Everything is invented demo data. The script is deterministic (fixed seeds, no clock, no network access),
so running it again gives byte-identical files; it needs only the Python 3.9+ standard library (zoneinfo;
on systems without the IANA database install the `tzdata` package).

Time: one row per hour from 2027-03-24 00:00 to 2027-04-02 23:00 local time in Europe/Madrid, i.e. a day of
margin before the default horizon (2027-03-25, 7 days) and two days after it. Rows step by one hour of real
(UTC) time, so the spring-forward on Sunday 2027-03-28 has no 02:00 row: 01:00+01:00 is followed by
03:00+02:00. Timestamps are ISO-8601 with the UTC offset in force at that instant.

How the numbers are made (all shapes follow local clock time, because people and tariffs do):
- Dry-weather influent: population equivalent (PE) x 180 L/PE/day (Gujer, Siedlungswasserwirtschaft [pub]),
  shaped by a diurnal pattern with a night minimum of about 50-60 % and a late-morning and an evening peak of
  about 130-150 % of the daily mean. Bigger catchments damp and delay the pattern (longer sewers); weekends and
  holidays peak later and a little lower. +-2 % deterministic noise.
- Storm: on Saturday 2027-03-27 a rain front raises flow at Dunmarrow (to about 1.8x) and Ambrook (about 2x)
  for some hours; Ambrook's peak exceeds its secondary capacity of 2150 m3/h for three hours on purpose
  (see networks/README.md, "Planted problems"). The summary printed at the end shows the bypass this implies.
- Biogas: about 28 L of digester gas per PE per day ("gas per person", civil engineering handbook [pub]),
  with a mild daytime rise (sludge is fed to the digesters in the day shift) and +-1.5 % noise.
- Tarnfield cooling water: cooling-tower make-up of the industrial park, following the day's heat and the
  working week; weekends and holidays run at about 60 %.
- Market price: an invented spring day-ahead shape (cheap night, midday solar dip, evening peak), lower on
  weekends and holidays, with day-to-day level changes and +-6 % noise.
- Availability: the Tessford filter/UV stage (3 units) is out for the whole local day of Tuesday 2027-03-30
  (UV channel drained for lamp-bank replacement), 3 units otherwise.
"""

from __future__ import annotations

import csv
import math
import random
from datetime import date, datetime, timedelta, timezone
from pathlib import Path
from zoneinfo import ZoneInfo

ZONE = ZoneInfo("Europe/Madrid")
FIRST_LOCAL = datetime(2027, 3, 24, 0, 0)
LAST_LOCAL = datetime(2027, 4, 2, 23, 0)
HOLIDAYS = {date(2027, 3, 26), date(2027, 3, 29)}  # Good Friday and Easter Monday in the demo region
STORM_DAY = date(2027, 3, 27)
OUTAGE_DAY = date(2027, 3, 30)
LITRES_PER_PE_PER_DAY = 180.0
GAS_LITRES_PER_PE_PER_DAY = 28.0
OUT_DIR = Path(__file__).resolve().parent

# Plant: PE, sewer lag in hours, amplitude factor on the diurnal swing, storm peak extra (x of dry flow).
PLANTS = {
    "dunmarrow": {"pe": 280_000, "lag": 2, "swing": 0.92, "storm": 0.80},
    "ambrook": {"pe": 120_000, "lag": 1, "swing": 1.00, "storm": 1.00},
    "tessford": {"pe": 55_000, "lag": 0, "swing": 1.08, "storm": 0.0},
    "whinlow": {"pe": 30_000, "lag": 0, "swing": 1.10, "storm": 0.0},
}
BIOGAS_PLANTS = ["dunmarrow", "ambrook", "tessford"]  # Whinlow stabilises its sludge aerobically: no digester

# Dry-weather diurnal shape by local hour (normalised to mean 1 below): low at 04-05, peaks at 10-11 and 20.
WEEKDAY_SHAPE = [0.80, 0.68, 0.60, 0.56, 0.55, 0.58, 0.70, 0.92, 1.18, 1.36, 1.42, 1.40,
                 1.32, 1.22, 1.12, 1.05, 1.03, 1.07, 1.18, 1.30, 1.34, 1.26, 1.10, 0.92]
# Weekends and holidays: people rise later, so the morning peak comes two hours later and a little lower.
WEEKEND_SHAPE = [0.86, 0.74, 0.64, 0.58, 0.55, 0.55, 0.58, 0.66, 0.82, 1.02, 1.20, 1.32,
                 1.36, 1.32, 1.22, 1.12, 1.06, 1.08, 1.16, 1.26, 1.30, 1.24, 1.12, 0.98]

# Spring day-ahead price shape, EUR/MWh by local hour.
PRICE_WEEKDAY = [72, 66, 62, 60, 60, 64, 80, 105, 112, 95, 70, 52,
                 40, 36, 38, 45, 62, 95, 140, 168, 175, 150, 118, 90]
PRICE_WEEKEND = [68, 62, 58, 56, 55, 56, 62, 74, 80, 70, 55, 42,
                 32, 28, 30, 36, 50, 80, 118, 140, 146, 126, 100, 80]


def normalised(shape: list[float]) -> list[float]:
    mean = sum(shape) / len(shape)
    return [v / mean for v in shape]


WEEKDAY = normalised(WEEKDAY_SHAPE)
WEEKEND = normalised(WEEKEND_SHAPE)


def hours() -> list[datetime]:
    """Every hour from FIRST_LOCAL to LAST_LOCAL as aware datetimes, stepping in UTC across DST changes."""
    start = FIRST_LOCAL.replace(tzinfo=ZONE).astimezone(timezone.utc)
    end = LAST_LOCAL.replace(tzinfo=ZONE).astimezone(timezone.utc)
    result = []
    t = start
    while t <= end:
        result.append(t.astimezone(ZONE))
        t += timedelta(hours=1)
    return result


def is_rest_day(d: date) -> bool:
    return d.weekday() >= 5 or d in HOLIDAYS


def stamp(t: datetime) -> str:
    return t.isoformat(timespec="seconds")


def storm_shape(local: datetime) -> float:
    """0..1 intensity of the storm's extra flow: rises from 03:00, full 09:00-12:00, gone by 22:00."""
    if local.date() != STORM_DAY:
        return 0.0
    h = local.hour
    if h < 3:
        return 0.0
    if h < 9:
        return (h - 2) / 7.0
    if h < 12:
        return 1.0
    if h < 22:
        return max(0.0, 1.0 - (h - 11) / 10.0) ** 1.5
    return 0.0


def influent(plant: str, local: datetime, rng: random.Random) -> float:
    p = PLANTS[plant]
    mean_m3_per_hour = p["pe"] * LITRES_PER_PE_PER_DAY / 1000.0 / 24.0
    lagged = local - timedelta(hours=p["lag"])
    shape = WEEKEND if is_rest_day(lagged.date()) else WEEKDAY
    factor = 1.0 + p["swing"] * (shape[lagged.hour] - 1.0)
    day_level = 0.97 if is_rest_day(lagged.date()) else 1.0
    storm = 1.0 + p["storm"] * storm_shape(lagged)
    noise = 1.0 + rng.uniform(-0.02, 0.02)
    return mean_m3_per_hour * factor * day_level * noise * storm


def biogas(plant: str, local: datetime, rng: random.Random) -> float:
    mean_nm3_per_hour = PLANTS[plant]["pe"] * GAS_LITRES_PER_PE_PER_DAY / 1000.0 / 24.0
    daytime = 1.0 + 0.06 * math.sin(2 * math.pi * (local.hour - 9) / 24.0)
    day_level = 1.0 + 0.03 * math.sin(local.toordinal() * 1.7)
    noise = 1.0 + rng.uniform(-0.015, 0.015)
    return mean_nm3_per_hour * daytime * day_level * noise


def cooling_demand(local: datetime, rng: random.Random) -> float:
    # Make-up water follows the heat: least before dawn, most mid-afternoon; the plants in the park work
    # two shifts on weekdays (06:00-22:00).
    heat = 0.5 * (1.0 + math.cos(2 * math.pi * (local.hour - 15) / 24.0))
    shift = 1.0 if 6 <= local.hour < 22 else 0.0
    weekday = 170.0 + 70.0 * heat + 80.0 * shift
    level = 0.6 if is_rest_day(local.date()) else 1.0
    noise = 1.0 + rng.uniform(-0.03, 0.03)
    return weekday * level * noise


def market_price(local: datetime, rng: random.Random) -> float:
    shape = PRICE_WEEKEND if is_rest_day(local.date()) else PRICE_WEEKDAY
    day_level = 1.0 + 0.08 * math.sin(local.toordinal() * 2.3)
    noise = 1.0 + rng.uniform(-0.06, 0.06)
    return shape[local.hour] * day_level * noise


def available_units(local: datetime) -> int:
    return 0 if local.date() == OUTAGE_DAY else 3


def write(name: str, header: list[str], rows: list[list[object]]) -> None:
    with open(OUT_DIR / name, "w", newline="", encoding="utf-8") as f:
        writer = csv.writer(f, lineterminator="\n")
        writer.writerow(header)
        writer.writerows(rows)


def fmt(value: float, decimals: int = 1) -> str:
    return f"{value:.{decimals}f}"


def main() -> None:
    times = hours()
    rngs = {name: random.Random(seed) for name, seed in
            [("influent", 20270325), ("biogas", 3), ("demand", 7), ("price", 11)]}

    influent_rows = [[stamp(t)] + [fmt(influent(p, t, rngs["influent"])) for p in PLANTS] for t in times]
    biogas_rows = [[stamp(t)] + [fmt(biogas(p, t, rngs["biogas"])) for p in BIOGAS_PLANTS] for t in times]
    demand_rows = [[stamp(t), fmt(cooling_demand(t, rngs["demand"]))] for t in times]
    price_rows = [[stamp(t), fmt(market_price(t, rngs["price"]), 2)] for t in times]
    availability_rows = [[stamp(t), available_units(t)] for t in times]

    write("influent.csv", ["timestamp"] + list(PLANTS), influent_rows)
    write("biogas.csv", ["timestamp"] + BIOGAS_PLANTS, biogas_rows)
    write("demand.csv", ["timestamp", "tarnfield-cooling"], demand_rows)
    write("market-price.csv", ["timestamp", "pricePerMWh"], price_rows)
    write("availability.csv", ["timestamp", "tessford-filter-uv"], availability_rows)

    summarise(times, influent_rows, biogas_rows, demand_rows)


def summarise(times, influent_rows, biogas_rows, demand_rows) -> None:
    """Prints daily totals and the storm bypass the data implies, as a check on the README's numbers."""
    capacities = {"dunmarrow": 6000.0, "ambrook": 2150.0, "tessford": 1000.0, "whinlow": 560.0}
    by_day: dict[date, dict[str, float]] = {}
    bypass = {p: 0.0 for p in PLANTS}
    peaks = {p: 0.0 for p in PLANTS}
    for t, row in zip(times, influent_rows):
        day = by_day.setdefault(t.date(), {p: 0.0 for p in PLANTS})
        for p, v in zip(PLANTS, row[1:]):
            flow = float(v)
            day[p] += flow
            if date(2027, 3, 25) <= t.date() <= date(2027, 3, 31):
                peaks[p] = max(peaks[p], flow)
                bypass[p] += max(0.0, flow - capacities[p])
    print("local day   hours  " + "  ".join(f"{p:>9}" for p in PLANTS) + "   (influent m3/day)")
    for d, totals in by_day.items():
        n = sum(1 for t in times if t.date() == d)
        print(f"{d}  {n:>4}  " + "  ".join(f"{totals[p]:9.0f}" for p in PLANTS))
    print("peak m3/h in horizon: " + ", ".join(f"{p} {peaks[p]:.0f}" for p in PLANTS))
    print("bypass implied by secondary capacity (m3): " + ", ".join(f"{p} {bypass[p]:.0f}" for p in PLANTS))
    cool = {}
    for t, row in zip(times, demand_rows):
        cool[t.date()] = cool.get(t.date(), 0.0) + float(row[1])
    print("tarnfield cooling m3/day: " + ", ".join(f"{d.day:02d} {v:.0f}" for d, v in cool.items()))
    gas = {}
    for t, row in zip(times, biogas_rows):
        gas[t.date()] = [a + float(b) for a, b in zip(gas.get(t.date(), [0.0] * 3), row[1:])]
    print("biogas Nm3/day (dunmarrow, ambrook, tessford): " + "; ".join(
        f"{d.day:02d} " + "/".join(f"{v:.0f}" for v in vals) for d, vals in gas.items()))


if __name__ == "__main__":
    main()
