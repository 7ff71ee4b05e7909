#!/usr/bin/env python3
"""Cross-checks networks/demo-region.json and prints the water, permit and energy balances the README quotes.

Run from anywhere:  python3 networks/demo-region/summarise.py   (Python 3.9+ standard library only)

This is a quick second look for whoever edits the demo data, not a replacement for `plandesk validate`:
- ids unique, every reference resolves, the class rule on stages and pipelines, CSV series regular and covering
  the default horizon (exit status 1 and a list of problems otherwise);
- demand per class and local day against the most the stages can produce;
- the storm bypass the influent series implies (influent above secondary capacity);
- a rough daily total-N load per plant and treatment level, assuming each plant's stages make exactly what its
  customers take that day (the planner may do better by storing water, so this is an upper bound for planning).
"""

from __future__ import annotations

import csv
import json
import sys
from collections import defaultdict
from datetime import date, datetime, timedelta, timezone
from pathlib import Path
from zoneinfo import ZoneInfo

NETWORK = Path(__file__).resolve().parent.parent / "demo-region.json"
problems: list[str] = []


def load_csv_series(base: Path, ref: dict) -> dict[datetime, float]:
    path = base / ref["csv"]
    with open(path, newline="", encoding="utf-8") as f:
        rows = list(csv.DictReader(f))
    if ref["column"] not in rows[0]:
        problems.append(f"{path.name}: no column '{ref['column']}'")
        return {}
    series = {}
    previous = None
    for line, row in enumerate(rows, start=2):
        t = datetime.fromisoformat(row["timestamp"]).astimezone(timezone.utc)
        if t in series:
            problems.append(f"{path.name} line {line}: duplicated timestamp {row['timestamp']}")
        if previous is not None and t - previous != timedelta(hours=1):
            problems.append(f"{path.name} line {line}: step {t - previous} is not one hour")
        previous = t
        series[t] = float(row[ref["column"]])
    return series


def main() -> None:
    net = json.loads(NETWORK.read_text(encoding="utf-8"))
    base = NETWORK.parent
    zone = ZoneInfo(net["timeZone"])
    start = date.fromisoformat(net["horizon"]["startDate"])
    days = [start + timedelta(days=d) for d in range(net["horizon"]["days"])]

    def day_hours(d: date) -> list[datetime]:
        a = datetime(d.year, d.month, d.day, tzinfo=zone).astimezone(timezone.utc)
        e = datetime.combine(d + timedelta(days=1), datetime.min.time(), tzinfo=zone).astimezone(timezone.utc)
        return [a + timedelta(hours=h) for h in range(int((e - a).total_seconds() // 3600))]

    horizon_hours = [t for d in days for t in day_hours(d)]

    classes = [c["id"] for c in net["qualityClasses"]]
    rank = {c: i for i, c in enumerate(classes)}
    ids: dict[str, str] = {}
    for kind, items in [("class", net["qualityClasses"]), ("tariff", net["tariffs"]), ("plant", net["plants"]),
                        ("stage", [s for p in net["plants"] for s in p["stages"]]), ("tank", net["tanks"]),
                        ("pipeline", net["pipelines"]), ("customer", net["customers"])]:
        for item in items:
            if item["id"] in ids:
                problems.append(f"id '{item['id']}' used by a {ids[item['id']]} and a {kind}")
            ids[item["id"]] = kind

    def need(kind: str, ref: str, where: str) -> None:
        if ids.get(ref) != kind:
            problems.append(f"{where}: '{ref}' is not a {kind}")

    def series(ref, where: str) -> dict[datetime, float] | None:
        if isinstance(ref, (int, float)):
            return None
        values = load_csv_series(base, ref)
        missing = [t for t in horizon_hours if t not in values]
        if missing:
            problems.append(f"{where}: {len(missing)} horizon hours missing, first {missing[0]}")
        return values

    tanks = {t["id"]: t for t in net["tanks"]}
    customers = {c["id"]: c for c in net["customers"]}
    for t in net["tanks"]:
        need("class", t["class"], f"tank {t['id']}")
        if "plant" in t:
            need("plant", t["plant"], f"tank {t['id']}")
        if not t["minM3"] <= t["initialM3"] <= t["maxM3"]:
            problems.append(f"tank {t['id']}: initial volume outside [min, max]")
    for tariff in net["tariffs"]:
        if "priceSeries" in tariff:
            series(tariff["priceSeries"], f"tariff {tariff['id']}")
    influent, gas = {}, {}
    for p in net["plants"]:
        need("tariff", p["tariff"], f"plant {p['id']}")
        levels = [lv["id"] for lv in p["treatmentLevels"]]
        if p["standardLevel"] not in levels:
            problems.append(f"plant {p['id']}: standard level '{p['standardLevel']}' not among {levels}")
        influent[p["id"]] = series(p["influentM3PerHour"], f"plant {p['id']} influent")
        if "biogas" in p:
            gas[p["id"]] = series(p["biogas"]["productionNm3PerHour"], f"plant {p['id']} biogas")
        for s in p["stages"]:
            need("tank", s["tank"], f"stage {s['id']}")
            need("class", s["producesClass"], f"stage {s['id']}")
            if s["tank"] in tanks and rank[tanks[s["tank"]]["class"]] < rank[s["producesClass"]]:
                problems.append(f"stage {s['id']}: its tank holds a better class than the stage produces")
            if s["feed"] != "secondary":
                need("tank", s["feed"], f"stage {s['id']} feed")
            if "availableUnits" in s:
                series(s["availableUnits"], f"stage {s['id']} availableUnits")
    for pl in net["pipelines"]:
        need("tank", pl["from"], f"pipeline {pl['id']}")
        to_class = tanks[pl["to"]]["class"] if pl["to"] in tanks else customers.get(pl["to"], {}).get("class")
        if to_class is None:
            problems.append(f"pipeline {pl['id']}: '{pl['to']}' is neither a tank nor a customer")
        elif rank[to_class] < rank[tanks[pl["from"]]["class"]]:
            problems.append(f"pipeline {pl['id']}: carries class {tanks[pl['from']]['class']} to a use needing {to_class}")
        if "plant" not in tanks[pl["from"]] and "poweredBy" not in pl:
            problems.append(f"pipeline {pl['id']}: from a regional reservoir, so it needs poweredBy")
        if "poweredBy" in pl:
            need("plant", pl["poweredBy"], f"pipeline {pl['id']}")
    demand = {}
    for c in net["customers"]:
        need("class", c["class"], f"customer {c['id']}")
        if not any(pl["to"] == c["id"] for pl in net["pipelines"]):
            problems.append(f"customer {c['id']}: no pipeline reaches it")
        if "demandM3PerHour" in c:
            demand[c["id"]] = series(c["demandM3PerHour"], f"customer {c['id']}")

    def stage_units(s):
        return series(s["availableUnits"], f"stage {s['id']}") if "availableUnits" in s else None

    report_balances(net, days, day_hours, rank, tanks, influent, gas, demand, stage_units)
    if problems:
        print("\nPROBLEMS:")
        for p in problems:
            print("  " + p)
        sys.exit(1)
    print("\nno problems found")


def report_balances(net, days, day_hours, rank, tanks, influent, gas, demand, series_or_none) -> None:
    classes = [c["id"] for c in net["qualityClasses"]]
    blend = {}
    for c in net["customers"]:
        if "blendLimit" in c:
            q = {k["id"]: k["quality"] for k in net["qualityClasses"]}
            limit = c["blendLimit"]
            worst = q[c["class"]][limit["parameter"]]
            best = q[classes[0]][limit["parameter"]]
            blend[c["id"]] = max(0.0, (worst - limit["max"]) / (worst - best))

    # Most each class can get per day: hour by hour, each plant's treated flow goes to its stages best class
    # first (each stage up to its available units at full flow); demand and capacity are also shown
    # cumulatively ("this class or better"), since a better class may serve a worse use.
    available = {s["id"]: series_or_none(s) for p in net["plants"] for s in p["stages"]}
    print(f"{'local day':<11}{'hours':>6}" + "".join(f"{'dem ' + k:>9}{'cap ' + k:>9}" for k in classes)
          + "   cumulative (class or better) demand/capacity")
    for d in days:
        hrs = day_hours(d)
        need = defaultdict(float)
        for c in net["customers"]:
            v = sum(demand[c["id"]][t] for t in hrs) if "demandM3PerHour" in c else c["dailyVolume"]["volumeM3"]
            share = blend.get(c["id"], 0.0)
            need[classes[0]] += v * share
            need[c["class"]] += v * (1 - share)
        cap = defaultdict(float)
        for p in net["plants"]:
            stages = sorted(p["stages"], key=lambda s: rank[s["producesClass"]])
            for t in hrs:
                left = min(influent[p["id"]][t], p["secondaryCapacityM3PerHour"])
                for s in stages:
                    units = available[s["id"]][t] if available[s["id"]] else s["units"]
                    feed = min(units * s["unitMaxFlowM3PerHour"], left)
                    left -= feed
                    cap[s["producesClass"]] += feed * s["recoveryFraction"]
        cumulative = []
        dem_sum = cap_sum = 0.0
        for k in classes:
            dem_sum += need[k]
            cap_sum += cap[k]
            cumulative.append(f"{k} {dem_sum:6.0f}/{cap_sum:6.0f}")
        print(f"{d!s:<11}{len(hrs):>6}" + "".join(f"{need[k]:>9.0f}{cap[k]:>9.0f}" for k in classes)
              + "   " + "  ".join(cumulative))
    print("(blend: " + ", ".join(f"{c} needs >= {v:.1%} of class {classes[0]}" for c, v in blend.items()) + ")")

    # Rough permit loads: stages make what the plant's own customers take (through pipelines from its tanks).
    plant_of_tank = {t["id"]: t.get("plant") for t in net["tanks"]}
    print("\nDaily total N, kg (stages make exactly what customers take; Gorsebrow fed from Dunmarrow):")
    for p in net["plants"]:
        pid = p["id"]
        caps = p["permit"]
        remaining = caps["monthlyTotalNitrogenKg"] - caps["monthToDateTotalNitrogenKg"]
        print(f"  {pid}: daily cap {caps['dailyTotalNitrogenKg']}, month remaining {remaining}")
        totals = defaultdict(float)
        for d in days:
            hrs = day_hours(d)
            flow = sum(influent[pid][t] for t in hrs)
            bypass = sum(max(0.0, influent[pid][t] - p["secondaryCapacityM3PerHour"]) for t in hrs)
            relief = 0.0
            for s in p["stages"]:
                units = series_or_none(s)
                if units and all(units[t] == 0 for t in hrs):
                    continue  # a whole-day outage: the stage makes nothing that day
                made = 0.0
                for c in net["customers"]:
                    feeds = [pl for pl in net["pipelines"] if pl["to"] == c["id"]]
                    for pl in feeds:
                        src = pl["from"]
                        via_reservoir = plant_of_tank.get(src) is None
                        if (src == s["tank"]) or (via_reservoir and s["tank"] == "dunmarrow-class-b"):
                            v = (sum(demand[c["id"]][t] for t in hrs) if "demandM3PerHour" in c
                                 else c["dailyVolume"]["volumeM3"])
                            share = blend.get(c["id"], 0.0)
                            if c["id"] in blend:
                                v *= share if tanks[src]["class"] == "R" else (1 - share)
                            made += v
                feed = made / s["recoveryFraction"]
                relief += feed * (1 - s.get("nutrientRejectionFraction", 0.0))
            line = []
            for lv in p["treatmentLevels"]:
                load = (flow - bypass - relief) * lv["effluentTotalNitrogenMgPerL"] / 1000 + bypass * p["rawTotalNitrogenMgPerL"] / 1000
                totals[lv["id"]] += load
                line.append(f"{lv['id']} {load:6.0f}")
            print(f"    {d}  flow {flow:7.0f}  bypass {bypass:4.0f}  reuse {relief:6.0f}  " + "  ".join(line))
        print("    7-day sums: " + ", ".join(f"{k} {v:.0f}" for k, v in totals.items()))

    print("\nEnergy, mean kW over the horizon (standard level, stages as above, pumping not included):")
    for p in net["plants"]:
        pid = p["id"]
        hrs = [t for d in days for t in day_hours(d)]
        flow = sum(influent[pid][t] for t in hrs) / len(hrs)
        aeration = flow * p["treatmentLevels"][0]["aerationEnergyKWhPerM3"]
        engine = 0.0
        if pid in gas:
            b = p["biogas"]
            engine = sum(gas[pid][t] for t in hrs) / len(hrs) * b["lowerHeatingValueKWhPerNm3"] * b["engineEfficiency"]
        print(f"  {pid}: mean influent {flow:6.0f} m3/h, aeration {aeration:5.0f} kW, base {p['baseLoadKw']} kW "
              f"-> {(aeration + p['baseLoadKw']) / flow:.2f} kWh/m3 before polishing; biogas engine can give {engine:4.0f} kW")


if __name__ == "__main__":
    main()
