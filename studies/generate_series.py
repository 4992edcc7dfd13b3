#!/usr/bin/env python3
# SPDX-License-Identifier: MIT
"""Generate the SYNTHETIC hourly series of the three invented demo studies.

Nothing here is measured data. The sites (Tarnbeck Saddle, Sandglass Mast, Pier Nine) are
invented; every series is computed from the formulas below and a fixed random seed, so running

    /usr/bin/python3 studies/generate_series.py

rewrites studies/*/hourly.csv and the two outdoor files studies/tarnbeck-saddle/ambient.csv and
studies/sandglass-mast/ambient.csv byte-identically. Python 3 standard library only.

Calendar
--------
One typical year of 8760 hours; the leap day is dropped. Day of year n = 1..365, hour of day
h = 0..23, row index hour = 24 (n - 1) + h. Times are local solar time; each hour is
represented by its middle, t = h + 0.5.

Clear-sky PV (Tarnbeck Saddle, Sandglass Mast)
----------------------------------------------
Solar geometry (Cooper's declination; hour angle; equator-facing tilted plane), degrees:
    declination   d  = 23.45 sin(360 (284 + n) / 365)
    hour angle    w  = 15 (t - 12)
    zenith        cos(z)  = sin(lat) sin(d) + cos(lat) cos(d) cos(w)
    incidence     cos(i)  = sin(lat - b) sin(d) + cos(lat - b) cos(d) cos(w)   (tilt b, facing south)
Extraterrestrial normal irradiance:  G0 = 1367 (1 + 0.033 cos(360 n / 365))  W/m2
Relative air mass (Kasten & Young 1989):
    AM = 1 / (cos(z) + 0.50572 (96.07995 - z)^-1.6364)
Clear-sky beam normal irradiance (Meinel & Meinel 1976 with the altitude term of Laue 1970,
altitude H in km):
    DNI = G0 ((1 - 0.14 H) 0.7^(AM^0.678) + 0.14 H)
Clear-sky diffuse horizontal = 0.1 DNI (rule of thumb); GHI = DNI cos(z) + DHI.
Plane-of-array (isotropic sky, ground albedo rho):
    POA = DNI max(cos(i), 0) + DHI (1 + cos b) / 2 + rho GHI (1 - cos b) / 2
Seeded daily cloudiness: a two-state (clear / overcast) Markov chain. With long-run overcast
share p and persistence r = P(overcast | overcast yesterday), P(overcast | clear yesterday) =
p (1 - r) / (1 - p). A clear day draws a clearness multiplier k ~ U(kc_lo, 1), an overcast day
k ~ U(ko_lo, ko_hi).
PV output (DC, before the charge controller, whose efficiency is in site.yaml):
    source_kw = P_stc_kWp x POA / 1000 x k x PR          (PR = performance ratio)

Off-grid loads
--------------
Tarnbeck: daily energy E(n) = 22 + 4 cos(2 pi (n - 15) / 365) kWh (26 kWh mid-January, 18 kWh
mid-July) times a seeded daily factor 1 + N(0, 0.06) clipped to [0.85, 1.15]. The hourly shape
is the seasonal interpolation S(h) = w S_winter(h) + (1 - w) S_summer(h) of two normalised
24-hour shapes with evening peaks (tables below), w = (1 + cos(2 pi (n - 15) / 365)) / 2.
    load_kw = E(n) S(h) (1 + N(0, 0.05))
Sandglass: flat 1.9 kWh/day, load_kw = 1.9 / 24 (1 + N(0, 0.02)), 4 decimals.

Battery-space temperature
-------------------------
    T = Tmean - Tamp cos(2 pi (n - 20) / 365)                       annual sinusoid, coldest day 20
        + a_n                                                      AR(1) daily anomaly:
                                                                   a_n = 0.7 a_(n-1) + N(0, s_a)
        + A(n) (0.5 + 0.5 k_n) cos(2 pi (t - t_peak) / 24)         daily swing, damped on dull days
        + N(0, 0.3)                                                hourly noise
    A(n) = A_winter w + A_summer (1 - w); then clipped to the site's stated range.
Tarnbeck: Tmean 8.5, Tamp 13.5, A 4 / 6, peak 15:00, s_a 1.8, clip [-12, 31].
Sandglass: Tmean 31.5, Tamp 7.5, A 4 / 5, peak 16:00, s_a 1.0, clip [18, 46].
Pier Nine (air-conditioned container): Tmean 23, Tamp 2.5, A 1 / 1, peak 17:00, s_a 0.5,
k = 1, clip [18, 30].

Pier Nine tender duty and tariff
--------------------------------
Evening peak shaving 17:00-21:00 (hours 17..20). Daily shaving demand
    D(n) = 420 + 60 cos(2 pi (n - 200) / 365) kW (more refrigeration in summer),
    times 1 + N(0, 0.06), times 0.8 on Sundays (day 1 is a Monday); per hour
    load_kw = min(500, D(n) x [0.90, 1.00, 1.00, 0.90][h - 17]); 0 in all other hours.
Grid charging allowance: source_kw = 350 kW in the night-tariff hours 22:00-06:00, 0 otherwise.
Tariff (illustrative 2026 level, EUR/kWh): night 22:00-06:00 0.095; day 0.165; evening peak
17:00-21:00 0.285 (the peak tariff is also the site's back-up price in site.yaml).

Outdoor air and horizontal irradiance (ambient.csv of Tarnbeck Saddle and Sandglass Mast)
--------------------------------------------------------------------------------------------
Same hours as the site's hourly.csv; load_kw and source_kw are copied from it as the same text.
Two outdoor columns are added for enclosure thermal models (solar heat gain, heat loss):
    irradiance_w_m2 = GHI_clear(n, t) x k_n                      1 decimal
GHI_clear is the clear-sky model above on a horizontal plane (tilt b = 0, so cos(i) = cos(z)
and POA = DNI cos(z) + DHI = GHI; albedo then drops out), at the site's latitude and altitude;
k_n is the same seeded daily clearness multiplier that scales that site's PV.
    ambient_c = outdoor air temperature, degC, 2 decimals
from the battery-space temperature formula above (same function, same k_n, so overcast days
have smaller daily swings), with outdoor parameters; its anomaly and hourly noise come from a
new stream, so the site's existing stream and files are untouched:
Tarnbeck outdoor (stream 4): Tmean 2.0, Tamp 12.0 (daily means about -10 degC in January and
+14 degC in July), A 6 / 3 (wider swing under clear winter skies), peak 14:00, s_a 1.5,
clip [-28, 28] (a safety bound that the seeded year does not reach).
Sandglass outdoor (stream 5): Tmean 27.0, Tamp 8.0 (about 19 degC in January and 35 degC in
July), A 9 / 7.5 (dry winter air cools faster at night), peak 15:00, s_a 1.0, clip [2, 50]
(not reached either).
These parameters are invented for the demo sites (chosen to give an alpine hut about 2 degC
mean with winter nights near -20 and summer days near +20, and a desert mast about 27 degC
mean with summer afternoons near 45 and winter nights near 8); they are not climate
statistics of any real place. The cosine daily shape puts the coldest hour 12 h after the
warmest rather than at sunrise, a simplification of the model.

Random numbers: random.Random(SEED + stream) with one stream per series, so that changing one
site leaves the others unchanged. Streams 1-3 are the hourly.csv files; 4 and 5 are the
outdoor temperature noise of ambient.csv.
"""

import math
import os
import random

SEED = 20260302
DAYS = 365
HERE = os.path.dirname(os.path.abspath(__file__))


def fmt(value, decimals=3):
    text = f"{value:.{decimals}f}"
    if text.startswith("-") and float(text) == 0.0:
        text = text[1:]
    return text


def winter_weight(n):
    """1 in mid-January, 0 in mid-July."""
    return (1.0 + math.cos(2.0 * math.pi * (n - 15) / 365.0)) / 2.0


# ---------------------------------------------------------------- solar model
def poa_clear_sky(n, t, lat_deg, tilt_deg, altitude_km, albedo):
    """Clear-sky plane-of-array irradiance, W/m2, at day n, solar time t (hours)."""
    rad = math.radians
    decl = rad(23.45 * math.sin(rad(360.0 * (284 + n) / 365.0)))
    omega = rad(15.0 * (t - 12.0))
    lat = rad(lat_deg)
    beta = rad(tilt_deg)
    cos_z = math.sin(lat) * math.sin(decl) + math.cos(lat) * math.cos(decl) * math.cos(omega)
    if cos_z <= 0.0:
        return 0.0
    zenith_deg = math.degrees(math.acos(cos_z))
    air_mass = 1.0 / (cos_z + 0.50572 * (96.07995 - zenith_deg) ** -1.6364)
    g0 = 1367.0 * (1.0 + 0.033 * math.cos(rad(360.0 * n / 365.0)))
    dni = g0 * ((1.0 - 0.14 * altitude_km) * 0.7 ** (air_mass ** 0.678) + 0.14 * altitude_km)
    dhi = 0.1 * dni
    ghi = dni * cos_z + dhi
    cos_i = (math.sin(lat - beta) * math.sin(decl)
             + math.cos(lat - beta) * math.cos(decl) * math.cos(omega))
    return (dni * max(cos_i, 0.0) + dhi * (1.0 + math.cos(beta)) / 2.0
            + albedo * ghi * (1.0 - math.cos(beta)) / 2.0)


def daily_clearness(rng, overcast_share, persistence, clear_low, overcast_low, overcast_high):
    """Seeded clearness multiplier per day (two-state Markov chain)."""
    p_clear_to_overcast = overcast_share * (1.0 - persistence) / (1.0 - overcast_share)
    overcast = rng.random() < overcast_share
    out = []
    for _ in range(DAYS):
        out.append(rng.uniform(overcast_low, overcast_high) if overcast
                   else rng.uniform(clear_low, 1.0))
        p = persistence if overcast else p_clear_to_overcast
        overcast = rng.random() < p
    return out


# ---------------------------------------------------------------- temperature
def temperature_series(rng, clearness, t_mean, t_amp, swing_winter, swing_summer, peak_hour,
                       anomaly_sd, t_min, t_max):
    temps = []
    anomaly = 0.0
    for n in range(1, DAYS + 1):
        anomaly = 0.7 * anomaly + rng.gauss(0.0, anomaly_sd)
        w = winter_weight(n)
        swing = (swing_winter * w + swing_summer * (1.0 - w)) * (0.5 + 0.5 * clearness[n - 1])
        daily_mean = t_mean - t_amp * math.cos(2.0 * math.pi * (n - 20) / 365.0) + anomaly
        for h in range(24):
            t = h + 0.5
            value = (daily_mean + swing * math.cos(2.0 * math.pi * (t - peak_hour) / 24.0)
                     + rng.gauss(0.0, 0.3))
            temps.append(min(t_max, max(t_min, value)))
    return temps


def normalised(shape):
    total = float(sum(shape))
    return [v / total for v in shape]


# Relative hourly weights, hour 0..23 (base load of instruments, network and fridge = 1).
TARNBECK_WINTER_SHAPE = normalised([
    1.0, 1.0, 1.0, 1.0, 1.0, 1.0, 1.0, 2.5,   # 00-07: base; 07 morning lights, kettle
    2.5, 1.5, 1.5, 1.5, 1.5, 1.5, 1.5, 1.5,   # 08-15: lab work
    1.5, 2.5, 3.5, 4.0, 4.0, 3.5, 2.5, 1.0,   # 16-23: evening peak (lights, cooking, pumps)
])
TARNBECK_SUMMER_SHAPE = normalised([
    1.0, 1.0, 1.0, 1.0, 1.0, 1.0, 2.0, 2.0,   # 00-07: base; 06-07 morning
    1.0, 1.8, 1.8, 1.8, 1.8, 1.8, 1.8, 1.8,   # 08-15: lab work in long days
    1.8, 1.8, 1.0, 2.5, 3.2, 3.0, 2.0, 1.0,   # 16-23: later, smaller evening peak
])


def write_csv(path, comments, header, rows):
    with open(path, "w", newline="\n", encoding="ascii") as out:
        for line in comments:
            out.write("# " + line + "\n")
        out.write(",".join(header) + "\n")
        for row in rows:
            out.write(",".join(row) + "\n")


def common_comments(site, stream, ambient_stream=None):
    if ambient_stream is None:
        streams = f"stream {stream}"
    else:
        streams = (f"streams {stream} (cloudiness, load_kw, source_kw) and {ambient_stream}"
                   " (ambient_c noise)")
    return [
        "SYNTHETIC DATA - not measured. Invented site: " + site + ".",
        f"Generated by studies/generate_series.py, seed {SEED}, {streams};"
        " rerun that script to reproduce this file byte for byte.",
        "One typical year: 8760 hourly rows, leap day dropped; hour 0 = 1 January 00:00-01:00"
        " local solar time.",
    ]


# ---------------------------------------------------------------- outdoor files
def ghi(n, t, lat_deg, altitude_km):
    """Clear-sky global horizontal irradiance, W/m2 (the plane-of-array model at tilt 0)."""
    return poa_clear_sky(n, t, lat_deg, 0.0, altitude_km, 0.0)


def write_ambient(folder, site, stream, ambient_stream, hourly_rows, clearness, lat_deg,
                  altitude_km, outdoor, comments):
    """Write folder/ambient.csv: the site's load_kw and source_kw text plus outdoor columns.

    outdoor holds the temperature_series parameters after the clearness list. The noise comes
    from its own stream, so the site's own stream and hourly.csv are unchanged.
    """
    rng = random.Random(SEED + ambient_stream)
    ambient = temperature_series(rng, clearness, *outdoor)
    rows = []
    irradiance = []
    for n in range(1, DAYS + 1):
        for h in range(24):
            i = 24 * (n - 1) + h
            g = ghi(n, h + 0.5, lat_deg, altitude_km) * clearness[n - 1]
            irradiance.append(g)
            rows.append([str(i), hourly_rows[i][1], hourly_rows[i][2], fmt(ambient[i], 2),
                         fmt(g, 1)])
    write_csv(os.path.join(HERE, folder, "ambient.csv"),
              common_comments(site, stream, ambient_stream) + comments,
              ["hour", "load_kw", "source_kw", "ambient_c", "irradiance_w_m2"], rows)
    print_ambient_stats(folder, ambient, irradiance)


def print_ambient_stats(folder, ambient, irradiance):
    """Sanity print to stdout (not into any file)."""
    daily = [sum(irradiance[24 * d:24 * d + 24]) / 1000.0 for d in range(DAYS)]
    daily_max = [max(ambient[24 * d:24 * d + 24]) for d in range(DAYS)]
    daily_min = [min(ambient[24 * d:24 * d + 24]) for d in range(DAYS)]
    jan, jul = range(0, 31), range(181, 212)
    print(f"{folder}/ambient.csv")
    print(f"  ambient_c       min {min(ambient):.2f}  mean {sum(ambient) / len(ambient):.2f}"
          f"  max {max(ambient):.2f}")
    print(f"  ambient_c       January mean daily min {sum(daily_min[d] for d in jan) / 31:.2f},"
          f" July mean daily max {sum(daily_max[d] for d in jul) / 31:.2f}")
    print(f"  irradiation     kWh/m2/day min {min(daily):.2f}  mean {sum(daily) / DAYS:.2f}"
          f"  max {max(daily):.2f}; year {sum(daily):.0f} kWh/m2")
    print(f"  irradiation     January mean {sum(daily[d] for d in jan) / 31:.2f},"
          f" July mean {sum(daily[d] for d in jul) / 31:.2f} kWh/m2/day")


# ---------------------------------------------------------------- Tarnbeck Saddle
def tarnbeck():
    stream = 1
    rng = random.Random(SEED + stream)
    pv_kwp, performance_ratio = 12.0, 0.85
    clearness = daily_clearness(rng, overcast_share=0.35, persistence=0.6,
                                clear_low=0.75, overcast_low=0.10, overcast_high=0.40)
    temps = temperature_series(rng, clearness, 8.5, 13.5, 4.0, 6.0, 15.0, 1.8, -12.0, 31.0)
    rows = []
    for n in range(1, DAYS + 1):
        w = winter_weight(n)
        energy = (22.0 + 4.0 * math.cos(2.0 * math.pi * (n - 15) / 365.0))
        energy *= min(1.15, max(0.85, 1.0 + rng.gauss(0.0, 0.06)))
        albedo = 0.2 + 0.4 * w   # snow on the ground in winter
        for h in range(24):
            i = 24 * (n - 1) + h
            shape = w * TARNBECK_WINTER_SHAPE[h] + (1.0 - w) * TARNBECK_SUMMER_SHAPE[h]
            load = max(0.0, energy * shape * (1.0 + rng.gauss(0.0, 0.05)))
            poa = poa_clear_sky(n, h + 0.5, 47.2, 60.0, 1.85, albedo)
            pv = pv_kwp * poa / 1000.0 * clearness[n - 1] * performance_ratio
            rows.append([str(i), fmt(load), fmt(pv), fmt(temps[i])])
    comments = common_comments("Tarnbeck Saddle field station (about 47.2 N, 1850 m)", stream) + [
        "load_kw: research hut DC+AC load, about 26 kWh/day in winter and 18 kWh/day in summer,"
        " evening peak.",
        "source_kw: 12 kWp PV, 60 deg tilt facing south, clear-sky model x seeded daily"
        " cloudiness x performance ratio 0.85.",
        "temp_c: unheated battery shed, annual sinusoid + daily swing + seeded noise, clipped"
        " to -12..31 degC.",
    ]
    write_csv(os.path.join(HERE, "tarnbeck-saddle", "hourly.csv"), comments,
              ["hour", "load_kw", "source_kw", "temp_c"], rows)
    write_ambient("tarnbeck-saddle", "Tarnbeck Saddle field station (about 47.2 N, 1850 m)",
                  stream, 4, rows, clearness, 47.2, 1.85,
                  (2.0, 12.0, 6.0, 3.0, 14.0, 1.5, -28.0, 28.0), [
        "load_kw, source_kw: the same values as hourly.csv (research hut load; 12 kWp PV at"
        " 60 deg tilt).",
        "ambient_c: outdoor air at the hut, annual sinusoid 2 +/- 12 degC + seeded weather"
        " anomaly + daily swing damped on overcast days + noise, 2 decimals.",
        "irradiance_w_m2: global horizontal irradiance, clear-sky model at tilt 0 x the same"
        " seeded daily clearness as the PV, 1 decimal.",
    ])


# ---------------------------------------------------------------- Sandglass Mast
def sandglass():
    stream = 2
    rng = random.Random(SEED + stream)
    pv_kwp, performance_ratio = 0.8, 0.80
    clearness = daily_clearness(rng, overcast_share=0.05, persistence=0.4,
                                clear_low=0.85, overcast_low=0.30, overcast_high=0.60)
    temps = temperature_series(rng, clearness, 31.5, 7.5, 4.0, 5.0, 16.0, 1.0, 18.0, 46.0)
    rows = []
    for n in range(1, DAYS + 1):
        for h in range(24):
            i = 24 * (n - 1) + h
            load = 1.9 / 24.0 * (1.0 + rng.gauss(0.0, 0.02))
            poa = poa_clear_sky(n, h + 0.5, 24.0, 40.0, 0.6, 0.3)
            pv = pv_kwp * poa / 1000.0 * clearness[n - 1] * performance_ratio
            rows.append([str(i), fmt(load, 4), fmt(pv), fmt(temps[i])])
    comments = common_comments("Sandglass Mast repeater (about 24 N, 600 m, desert)", stream) + [
        "load_kw: telecom relay, flat 1.9 kWh/day with small seeded noise (4 decimals).",
        "source_kw: 0.8 kWp PV, 40 deg tilt facing south, clear-sky model x seeded daily"
        " cloudiness/dust x performance ratio 0.80.",
        "temp_c: battery cabinet in a desert shelter, annual sinusoid + daily swing + seeded"
        " noise, clipped to 18..46 degC.",
    ]
    write_csv(os.path.join(HERE, "sandglass-mast", "hourly.csv"), comments,
              ["hour", "load_kw", "source_kw", "temp_c"], rows)
    write_ambient("sandglass-mast", "Sandglass Mast repeater (about 24 N, 600 m, desert)",
                  stream, 5, rows, clearness, 24.0, 0.6,
                  (27.0, 8.0, 9.0, 7.5, 15.0, 1.0, 2.0, 50.0), [
        "load_kw, source_kw: the same values as hourly.csv (telecom relay load; 0.8 kWp PV at"
        " 40 deg tilt).",
        "ambient_c: outdoor desert air, annual sinusoid 27 +/- 8 degC + seeded weather"
        " anomaly + daily swing damped on dusty/overcast days + noise, 2 decimals.",
        "irradiance_w_m2: global horizontal irradiance, clear-sky model at tilt 0 x the same"
        " seeded daily clearness as the PV, 1 decimal.",
    ])


# ---------------------------------------------------------------- Pier Nine tender
NIGHT_PRICE, DAY_PRICE, PEAK_PRICE = 0.095, 0.165, 0.285
PEAK_HOURS = (17, 18, 19, 20)
PEAK_SHAPE = (0.90, 1.00, 1.00, 0.90)


def is_night(h):
    return h >= 22 or h < 6


def pier_nine():
    stream = 3
    rng = random.Random(SEED + stream)
    ones = [1.0] * DAYS
    temps = temperature_series(rng, ones, 23.0, 2.5, 1.0, 1.0, 17.0, 0.5, 18.0, 30.0)
    rows = []
    for n in range(1, DAYS + 1):
        demand = 420.0 + 60.0 * math.cos(2.0 * math.pi * (n - 200) / 365.0)
        demand *= 1.0 + rng.gauss(0.0, 0.06)
        if (n - 1) % 7 == 6:   # day 1 is a Monday, so every 7th day is a Sunday
            demand *= 0.8
        for h in range(24):
            i = 24 * (n - 1) + h
            if h in PEAK_HOURS:
                load = min(500.0, demand * PEAK_SHAPE[h - 17])
                price = PEAK_PRICE
            else:
                load = 0.0
                price = NIGHT_PRICE if is_night(h) else DAY_PRICE
            source = 350.0 if is_night(h) else 0.0
            rows.append([str(i), fmt(load), fmt(source), fmt(temps[i]), fmt(price)])
    comments = common_comments("Pier Nine cold store (tender evaluation)", stream) + [
        "load_kw: evening peak-shaving duty 17:00-21:00 the bank must deliver (capped at"
        " 500 kW), summer-high, lower on Sundays; 0 in other hours.",
        "source_kw: grid charging allowance, 350 kW in night-tariff hours 22:00-06:00.",
        "temp_c: air-conditioned battery container. price_per_kwh: illustrative tariff,"
        " night 0.095 / day 0.165 / peak 0.285 EUR/kWh.",
    ]
    write_csv(os.path.join(HERE, "pier-nine-tender", "hourly.csv"), comments,
              ["hour", "load_kw", "source_kw", "temp_c", "price_per_kwh"], rows)


def main():
    tarnbeck()
    sandglass()
    pier_nine()


if __name__ == "__main__":
    main()
