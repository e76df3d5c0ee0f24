//! The collision report as CSV: one row per meaning class of each shown group.

use crate::audit::report::CollisionReport;

const HEADER: [&str; 10] = [
    "rank",
    "key",
    "risk",
    "evenness",
    "meaning",
    "documents",
    "searches",
    "forms",
    "kept",
    "affected_searches",
];

pub fn render(report: &CollisionReport) -> String {
    let mut writer = csv::Writer::from_writer(Vec::new());
    let _ = writer.write_record(HEADER);
    for c in &report.collisions {
        let col = &c.collision;
        for class in &col.classes {
            let forms: Vec<&str> = class.forms.iter().map(|f| f.form.as_str()).collect();
            let _ = writer.write_record([
                c.rank.to_string(),
                col.key.clone(),
                format!("{:.1}", col.risk),
                format!("{:.3}", col.evenness),
                class.base.clone(),
                class.documents.to_string(),
                class.searches.to_string(),
                forms.join(" "),
                c.suggestion
                    .as_ref()
                    .map_or(String::new(), |s| s.kept.clone()),
                c.effect
                    .as_ref()
                    .map_or(String::new(), |e| e.searches.to_string()),
            ]);
        }
    }
    let bytes = writer.into_inner().unwrap_or_default();
    String::from_utf8(bytes).expect("CSV of UTF-8 fields is UTF-8")
}
