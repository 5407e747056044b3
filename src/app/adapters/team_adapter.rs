//! TeamAdapter: the Team page.

use slint::ComponentHandle;

use super::super::session::{EntryTarget, Session};
use super::super::ui::{AppWindow, DiverCard, TeamAdapter};
use super::super::view_models as vm;
use super::{Shared, act, handles, model, strings};

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<TeamAdapter>();
    let (w, st) = handles(ui, s);
    a.on_edit_name(move |i| {
        act(&w, &st, |x| {
            x.open_entry(EntryTarget::DiverName(i as usize))
        })
    });
    let (w, st) = handles(ui, s);
    a.on_pick_cylinders(move |i| act(&w, &st, |x| x.open_cylinder_picker(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_pick_mix(move |i| act(&w, &st, |x| x.open_mix_picker(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_edit_start(move |i| act(&w, &st, |x| x.open_entry(EntryTarget::Start(i as usize))));
    let (w, st) = handles(ui, s);
    a.on_nudge_start(move |i, d| act(&w, &st, |x| x.nudge_start(i as usize, d)));
    let (w, st) = handles(ui, s);
    a.on_choose_gauge(move |i| act(&w, &st, |x| x.open_gauge_chooser(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_confirm_start(move |i| act(&w, &st, |x| x.confirm_start(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_edit_sac(move |i| act(&w, &st, |x| x.open_entry(EntryTarget::Sac(i as usize))));
    let (w, st) = handles(ui, s);
    a.on_remove_diver(move |i| act(&w, &st, |x| x.remove_diver(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_add_diver(move || act(&w, &st, |x| x.add_diver()));
    let (w, st) = handles(ui, s);
    a.on_set_rule(move |i| act(&w, &st, |x| x.set_rule(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_set_step(move |i| act(&w, &st, |x| x.set_step(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_edit_depth(move || act(&w, &st, |x| x.open_entry(EntryTarget::Depth)));
    let (w, st) = handles(ui, s);
    a.on_toggle_water(move || act(&w, &st, |x| x.toggle_water()));
    let (w, st) = handles(ui, s);
    a.on_nudge_water_temp(move |d| act(&w, &st, |x| x.nudge_water_temp(d)));
    let (w, st) = handles(ui, s);
    a.on_edit_water_temp(move || act(&w, &st, |x| x.open_entry(EntryTarget::WaterTemp)));
    let (w, st) = handles(ui, s);
    a.on_undo(move || act(&w, &st, |x| x.undo()));
    let (w, st) = handles(ui, s);
    a.on_new_team(move || act(&w, &st, |x| x.new_team()));
    let (w, st) = handles(ui, s);
    a.on_next_dive(move || act(&w, &st, |x| x.next_dive()));
    let (w, st) = handles(ui, s);
    a.on_pick_stage(move |i| act(&w, &st, |x| x.open_stage_picker(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_pick_stage_mix(move |i| act(&w, &st, |x| x.open_stage_mix_picker(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_edit_stage_start(move |i| {
        act(&w, &st, |x| {
            x.open_entry(EntryTarget::StageStart(i as usize))
        })
    });
    let (w, st) = handles(ui, s);
    a.on_save_to_locker(move |i| act(&w, &st, |x| x.save_diver_cylinders(i as usize)));
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<TeamAdapter>();
    let cards: Vec<DiverCard> = vm::diver_cards(s)
        .into_iter()
        .map(|c| DiverCard {
            name: c.name.into(),
            cylinders: vm::keep_units_together(&c.cylinders).into(),
            mix: c.mix.into(),
            start: c.start.into(),
            unit: c.unit.into(),
            gauge: c.gauge.into(),
            start_note: c.start_note.into(),
            confirm: c.confirm.into(),
            read: c.read.into(),
            start_ok: c.start_ok,
            sac: c.sac.into(),
            error: c.error.into(),
            has_stage: c.has_stage,
            stage: c.stage.into(),
            stage_mix: c.stage_mix.into(),
            stage_start: c.stage_start.into(),
        })
        .collect();
    a.set_divers(model(cards));
    let p = vm::team_page(s);
    a.set_rule_options(strings(vm::rule_symbols()));
    a.set_rule_labels(strings(vm::rule_names()));
    a.set_rule_index(p.rule_index);
    a.set_rule_warning(p.rule_warning.into());
    a.set_step_options(strings(p.step_options));
    a.set_step_index(p.step_index);
    a.set_depth_text(p.depth_text.into());
    a.set_water_text(vm::keep_units_together(&p.water_text).into());
    a.set_water_temp(p.water_temp.into());
    a.set_settings_summary(vm::keep_units_together(&p.settings_summary).into());
    a.set_undo_text(vm::keep_units_together(&p.undo).into());
    a.set_can_add(p.can_add);
    a.set_can_remove(p.can_remove);
    a.set_summary(vm::keep_units_together(&p.summary).into());
}
