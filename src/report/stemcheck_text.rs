//! The stemcheck table as text.

use std::fmt::Write as _;

use crate::audit::stemcheck::{Row, StemcheckReport};

pub fn render(report: &StemcheckReport) -> String {
    let mut out = format!(
        "stemmer error indices (Paice) on {} words in {} concept groups from {}\n\n",
        report.words, report.groups, report.source
    );
    let _ = writeln!(
        out,
        "{:<40} {:>8} {:>8} {:>9} {:>7}",
        "stemmer", "UI", "OI", "SW", "ERRT"
    );
    for row in &report.rows {
        line(&mut out, row);
    }
    out.push('\n');
    for row in &report.truncation {
        line(&mut out, row);
    }
    out
}

fn line(out: &mut String, row: &Row) {
    let i = &row.indices;
    let opt = |v: Option<f64>, digits: usize| {
        v.map_or_else(|| "-".to_string(), |v| format!("{v:.digits$}"))
    };
    let _ = writeln!(
        out,
        "{:<40} {:>8.5} {:>8.6} {:>9} {:>7}",
        row.name,
        i.ui,
        i.oi,
        opt(i.sw, 5),
        opt(i.errt, 3)
    );
}
