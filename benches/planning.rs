//! Speed of the planning core: one real-gas content evaluation, one inverse solve (direct,
//! and the bisection it replaced), building a model, and whole team plans (the app
//! recomputes on every key press), and a 41 × 41 pairing chart. Figures and how to reproduce them: BENCHMARKS.md.

use criterion::{Criterion, criterion_group, criterion_main};
use std::hint::black_box;
use turnsheet::formats::team_file::TeamFile;
use turnsheet::plan::bracketed_pressure;
use turnsheet::plan::{ContentModel, Mix, Pressure, RealGasModel, Temperature, Volume, plan_team};

fn benches(c: &mut Criterion) {
    let model = RealGasModel::new(Mix::trimix(0.21, 0.35), Temperature::from_celsius(12.0));
    c.bench_function("real_gas_content", |b| {
        b.iter(|| {
            model.content(
                black_box(Volume::from_litres(24.0)),
                black_box(Pressure::from_bar(232.0)),
            )
        })
    });
    c.bench_function("real_gas_inverse", |b| {
        b.iter(|| {
            model.pressure_for(
                black_box(Volume::from_litres(24.0)),
                black_box(Volume::from_litres(3000.0)),
            )
        })
    });
    // The 40-step bisection the direct inverse replaced (kept as its test oracle).
    c.bench_function("real_gas_inverse_bisection", |b| {
        b.iter(|| {
            let water = black_box(Volume::from_litres(24.0));
            bracketed_pressure(|p| model.content(water, p).litres(), black_box(3000.0))
        })
    });
    c.bench_function("real_gas_model_new", |b| {
        b.iter(|| {
            RealGasModel::new(
                black_box(Mix::trimix(0.21, 0.35)),
                black_box(Temperature::from_celsius(12.0)),
            )
        })
    });
    let text = include_str!("../examples/hollowmere-team.json");
    let team = TeamFile::parse(text).unwrap().to_input().unwrap();
    c.bench_function("plan_team_3_divers", |b| {
        b.iter(|| plan_team(black_box(&team)).unwrap())
    });
    let mut six = team.clone();
    let extra = six.divers.clone();
    for (i, mut d) in extra.into_iter().enumerate() {
        d.name = format!("{} 2", d.name);
        d.start = Pressure::from_bar(d.start.bar() - 10.0 * i as f64);
        six.divers.push(d);
    }
    c.bench_function("plan_team_6_divers", |b| {
        b.iter(|| plan_team(black_box(&six)).unwrap())
    });
    // A 41 × 41 pairing chart (Ines against Bram, 41 starts each on 5 bar).
    let rows: Vec<f64> = (0..41).map(|k| 230.0 - 5.0 * k as f64).collect();
    let cols: Vec<f64> = (0..41).map(|k| 205.0 - 4.0 * k as f64).collect();
    c.bench_function("pair_chart_41x41", |b| {
        b.iter(|| turnsheet::plan::pair_chart(black_box(&team), 0, 1, &rows, &cols).unwrap())
    });
}

criterion_group!(planning, benches);
criterion_main!(planning);
